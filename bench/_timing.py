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
