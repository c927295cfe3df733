"""Safe output files: atomic writes that never replace an input file.

Every file colligate writes goes first to a temporary file in the target
directory, is flushed to disk, then renamed over the target with
:func:`os.replace` (atomic on POSIX and Windows for a same-directory rename).
A reader therefore sees either the old file or the complete new one.
"""

from __future__ import annotations

import os
import tempfile
from typing import Callable, Iterable, IO

__all__ = ["OutputPathError", "check_output_path", "atomic_write", "atomic_write_text"]


class OutputPathError(ValueError):
    """An output path is unusable (it is an input file, a directory, or its folder is missing)."""


def _same_file(a: str, b: str) -> bool:
    if os.path.abspath(a) == os.path.abspath(b):
        return True
    try:
        return os.path.samefile(a, b)
    except OSError:
        return False


def check_output_path(path: str | os.PathLike[str], inputs: Iterable[str | os.PathLike[str]] = (), what: str = "output") -> str:
    """Validate an output path and return it as ``str``.

    Refuses a path that names one of ``inputs`` (also through links), an
    existing directory, or a file in a directory that does not exist.
    """
    target = os.fspath(path)
    if not target:
        raise OutputPathError(f"{what} path is empty")
    for src in inputs:
        if src is not None and _same_file(target, os.fspath(src)):
            raise OutputPathError(f"{what} path '{target}' is the input file; refusing to overwrite an input")
    if os.path.isdir(target):
        raise OutputPathError(f"{what} path '{target}' is a directory; give a file name")
    folder = os.path.dirname(os.path.abspath(target))
    if not os.path.isdir(folder):
        raise OutputPathError(f"{what} path '{target}': directory '{folder}' does not exist")
    return target


def atomic_write(
    path: str | os.PathLike[str],
    writer: Callable[[IO[bytes]], None],
    inputs: Iterable[str | os.PathLike[str]] = (),
    what: str = "output",
) -> str:
    """Write a file atomically: ``writer`` fills a binary temporary file, which then replaces ``path``.

    Returns the path written. The temporary file is removed on any failure.
    """
    target = check_output_path(path, inputs, what)
    folder = os.path.dirname(os.path.abspath(target))
    base = os.path.basename(target)
    fd, tmp = tempfile.mkstemp(prefix=f".{base}.", suffix=".tmp", dir=folder)
    try:
        with os.fdopen(fd, "wb") as fh:
            writer(fh)
            fh.flush()
            os.fsync(fh.fileno())
        # mkstemp creates 0600; give the result the usual permissions.
        umask = os.umask(0)
        os.umask(umask)
        os.chmod(tmp, 0o666 & ~umask)
        os.replace(tmp, target)
    except BaseException:
        try:
            os.unlink(tmp)
        except OSError:
            pass
        raise
    return target


def atomic_write_text(
    path: str | os.PathLike[str],
    text: str,
    inputs: Iterable[str | os.PathLike[str]] = (),
    what: str = "output",
) -> str:
    """Write UTF-8 ``text`` to ``path`` atomically (see :func:`atomic_write`)."""
    data = text.encode("utf-8")
    return atomic_write(path, lambda fh: fh.write(data), inputs, what)
