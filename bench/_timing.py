"""Timing helper shared by the benchmarks (timing lives only in bench/)."""
from __future__ import annotations

import time


def best_of(fn, repeat: int = 3) -> float:
    """Smallest wall time of `repeat` calls of fn(), seconds."""
    times = []
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t)
    return min(times)


def best_of_cpu(fn, repeat: int = 3) -> tuple[float, float]:
    """Smallest wall time and smallest CPU time of this process (all its threads) over
    `repeat` calls of fn(), seconds. For work done on one core at a time (a one-thread batch
    call, which runs on a worker while the calling thread waits for Ctrl-C; gsw; NumPy) the
    CPU time is the honest cost per core on a shared machine; the wall time also counts the
    time other processes held the core."""
    walls, cpus = [], []
    for _ in range(repeat):
        t, c = time.perf_counter(), time.process_time()
        fn()
        cpus.append(time.process_time() - c)
        walls.append(time.perf_counter() - t)
    return min(walls), min(cpus)
