"""Safe files: bounded input reads, and output writes that never destroy anything.

Outputs
-------
Every file colligate writes goes first to a hidden temporary file in the target's
folder, is flushed to disk, then renamed over the target with :func:`os.replace`
(atomic on POSIX and Windows for a same-folder rename). A reader therefore sees either
the old file or the complete new one. Targets are checked first:

* an input file of the command is never overwritten (also through another spelling or
  a link);
* only regular files are replaced. A named pipe, a device (``/dev/null``), a socket or a
  folder is refused; a symbolic link to a regular file is written *through*: the file it
  points to is replaced and the link stays; a link that points to nothing is refused;
* the folder must exist and be writable; errors name the option and the path the user
  gave, never the temporary file.

:class:`OutputSet` groups the outputs of one command: every path is checked (and two
outputs on one path refused) before anything is computed, each file is written to its
temporary file as it is made, and all of them are renamed into place together by
:meth:`OutputSet.commit`. If the command fails or is interrupted first, the temporary
files are removed and no output appears: a command writes all its files or none.

Inputs
------
:func:`read_input_bytes` reads an input file of at most :data:`MAX_INPUT_BYTES`, so a
huge or endless file (``/dev/zero``) gives a clear error instead of exhausting memory.
"""

from __future__ import annotations

import errno
import os
import secrets
import signal
import stat
import threading
from typing import IO, Callable, Iterable, Optional

from . import _core

__all__ = [
    "MAX_INPUT_BYTES",
    "InputFileError",
    "OutputPathError",
    "OutputSet",
    "check_output_path",
    "atomic_write",
    "atomic_write_text",
    "read_input_bytes",
]

#: Largest input file colligate reads (recipes, libraries, fit data), bytes: 10 MiB. A
#: recipe is a few hundred bytes and a lab data set a few hundred kilobytes.
MAX_INPUT_BYTES = 10 * 1024 * 1024


class OutputPathError(_core.InvalidInputError):
    """An output path is unusable: it names an input file, a folder, something that is
    not a regular file (a device, a named pipe), a missing or unwritable folder, or the
    same file as another output of the command. The message names the option and path."""


class InputFileError(_core.InvalidInputError):
    """An input file is missing, unreadable or larger than :data:`MAX_INPUT_BYTES`.
    The message names the file and, for size, the limit."""


# --------------------------------------------------------------------------- inputs


def _mebibytes(n: int) -> str:
    return f"{n / (1024 * 1024):.3g} MB"


def read_input_bytes(path: str | os.PathLike[str], what: str = "input",
                     limit: int = MAX_INPUT_BYTES) -> bytes:
    """The bytes of an input file, refusing files larger than ``limit`` bytes.

    Works for regular files and for pipes (it stops reading at ``limit + 1`` bytes).

    Raises
    ------
    InputFileError
        ``"<what> '<path>': ..."``: not found, a folder, unreadable, or too large
        (the message gives the size or the limit).
    """
    source = os.fspath(path)
    prefix = f"{what} '{source}'"
    try:
        with open(source, "rb") as fh:
            st = os.fstat(fh.fileno())
            if stat.S_ISDIR(st.st_mode):
                raise IsADirectoryError(errno.EISDIR, os.strerror(errno.EISDIR), source)
            if stat.S_ISREG(st.st_mode) and st.st_size > limit:
                raise InputFileError(
                    f"{prefix}: file is {_mebibytes(st.st_size)} ({st.st_size} bytes); input files "
                    f"are limited to {_mebibytes(limit)} ({limit} bytes)")
            data = fh.read(limit + 1)
    except FileNotFoundError:
        raise InputFileError(f"{prefix}: file not found") from None
    except IsADirectoryError:
        raise InputFileError(f"{prefix}: is a directory, expected a file") from None
    except OSError as exc:
        raise InputFileError(f"{prefix}: cannot read file ({exc.strerror or exc})") from None
    if len(data) > limit:
        raise InputFileError(
            f"{prefix}: more than {_mebibytes(limit)} ({limit} bytes); input files are limited to "
            f"{_mebibytes(limit)}")
    return data


# --------------------------------------------------------------------------- outputs


def _same_file(a: str, b: str) -> bool:
    if os.path.abspath(a) == os.path.abspath(b):
        return True
    if os.path.realpath(a) == os.path.realpath(b):
        return True
    try:
        return os.path.samefile(a, b)
    except OSError:
        return False


_KINDS = (
    (stat.S_ISFIFO, "a named pipe (FIFO)"),
    (stat.S_ISCHR, "a character device"),
    (stat.S_ISBLK, "a block device"),
    (stat.S_ISSOCK, "a socket"),
    (stat.S_ISDIR, "a directory"),
)


def _kind(mode: int) -> str:
    for test, name in _KINDS:
        if test(mode):
            return name
    return "not a regular file"


def _real_target(what: str, target: str) -> str:
    """The file that writing ``target`` replaces: ``target`` itself, or the regular file a
    symbolic link points to. Refuses anything that is not (a link to) a regular file."""
    try:
        lst = os.lstat(target)
    except FileNotFoundError:
        return target
    except OSError as exc:
        raise OutputPathError(f"{what} '{target}': cannot inspect the path ({exc.strerror or exc})") from None
    if stat.S_ISLNK(lst.st_mode):
        real = os.path.realpath(target)
        try:
            st = os.stat(real)
        except FileNotFoundError:
            raise OutputPathError(
                f"{what} '{target}': a symbolic link to '{real}', which does not exist; give a regular "
                "file or a link to an existing regular file") from None
        except OSError as exc:
            raise OutputPathError(f"{what} '{target}': cannot follow the link ({exc.strerror or exc})") from None
        if not stat.S_ISREG(st.st_mode):
            raise OutputPathError(
                f"{what} '{target}': a symbolic link to '{real}', which is {_kind(st.st_mode)}; colligate "
                "writes only regular files")
        return real
    if stat.S_ISDIR(lst.st_mode):
        raise OutputPathError(f"{what} path '{target}' is a directory; give a file name")
    if not stat.S_ISREG(lst.st_mode):
        raise OutputPathError(
            f"{what} '{target}' is {_kind(lst.st_mode)}; colligate writes only regular files and "
            "never replaces anything else")
    return target


def check_output_path(path: str | os.PathLike[str], inputs: Iterable[Optional[str | os.PathLike[str]]] = (),
                      what: str = "output") -> str:
    """Validate an output path and return it as ``str``.

    Refuses a path that names one of ``inputs`` (also through links), a folder, anything
    that is not a regular file or a link to one, and a file in a folder that does not
    exist or cannot be written. ``what`` (the option, e.g. ``"--plot"``) starts every
    message.
    """
    if isinstance(path, bytes) or not isinstance(path, (str, os.PathLike)):
        raise OutputPathError(f"{what} path = {path!r}: must be a file name (str or path)")
    target = os.fspath(path)
    if not isinstance(target, str):
        raise OutputPathError(f"{what} path = {target!r}: must be a text file name")
    if not target:
        raise OutputPathError(f"{what} path is empty; give a file name")
    if "\0" in target:
        raise OutputPathError(f"{what} path {target!r}: contains a NUL character")
    for src in inputs:
        if src is not None and _same_file(target, os.fspath(src)):
            raise OutputPathError(f"{what} path '{target}' is the input file; refusing to overwrite an input")
    real = _real_target(what, target)
    folder = os.path.dirname(os.path.abspath(real))
    if not os.path.isdir(folder):
        raise OutputPathError(f"{what} path '{target}': directory '{folder}' does not exist")
    if not os.access(folder, os.W_OK | os.X_OK):
        raise OutputPathError(f"{what} path '{target}': directory '{folder}' is not writable")
    return target


_HELD_SIGNALS = tuple(getattr(signal, name) for name in ("SIGINT", "SIGTERM") if hasattr(signal, name))


class _HeldSignals:
    """The handlers replaced by :func:`_block_interrupts` and the signals that arrived."""

    __slots__ = ("handlers", "pending")

    def __init__(self) -> None:
        self.handlers: dict[int, object] = {}
        self.pending: list[tuple[int, object]] = []

    def defer(self, signum, frame) -> None:
        self.pending.append((signum, frame))


def _block_interrupts() -> Optional[_HeldSignals]:
    """Hold back Ctrl-C (SIGINT) and SIGTERM while files are created or renamed, so an
    interrupt cannot stop a command between two steps that must go together. Their Python
    handlers are replaced by one that only records the signal; :func:`_restore_interrupts`
    puts the handlers back and then runs the one of the first signal that came. (Blocking the
    signal in this thread would not do: the kernel then hands a process-wide signal to
    another thread, such as a BLAS worker, and Python raises it here all the same.) Main
    thread only (where Python runs signal handlers); a no-op elsewhere. Returns the state to
    restore, or None."""
    if threading.current_thread() is not threading.main_thread():
        return None
    held = _HeldSignals()
    for signum in _HELD_SIGNALS:
        old = signal.getsignal(signum)
        if old is None:  # installed outside Python: cannot be put back, leave it
            continue
        held.handlers[signum] = old
        signal.signal(signum, held.defer)
    return held


def _restore_interrupts(held: Optional[_HeldSignals]) -> None:
    """Put back the handlers :func:`_block_interrupts` replaced, then deliver the first
    signal held back (a Ctrl-C raises KeyboardInterrupt here, after the protected step)."""
    if held is None:
        return
    for signum, old in held.handlers.items():
        signal.signal(signum, old)
    if not held.pending:
        return
    signum, frame = held.pending[0]
    old = held.handlers.get(signum)
    if callable(old):
        old(signum, frame)
    elif old == signal.SIG_DFL:
        signal.raise_signal(signum)


class _Staged:
    __slots__ = ("target", "real", "tmp", "what")

    def __init__(self, target: str, real: str, tmp: str, what: str) -> None:
        self.target, self.real, self.tmp, self.what = target, real, tmp, what


def _write_temporary(target: str, real: str, writer: Callable[[IO[bytes]], None], what: str,
                     on_created: Callable[[str], None]) -> str:
    """Fill a new hidden file beside ``real`` with ``writer``; returns its path.

    ``on_created(tmp)`` records the new file with its owner (the :class:`OutputSet`) in the
    same step that creates it: Ctrl-C is held back from the ``os.open`` until the file is
    recorded, so an interrupt can never leave a temporary file that nobody will remove.
    From the moment the file exists every failure removes it, including a Ctrl-C that was
    held back and surfaces only after the mask is lifted (Python raises it at the next
    bytecode, which may lie past the call that lifted the mask)."""
    folder = os.path.dirname(os.path.abspath(real))
    base = os.path.basename(real)
    created: Optional[str] = None
    fh = None
    old = _block_interrupts()
    blocked = True
    try:
        while True:
            tmp = os.path.join(folder, f".{base}.{secrets.token_hex(6)}.tmp")
            try:
                # O_EXCL: never reuse or follow anything already there; mode 0o666 minus the umask.
                fd = os.open(tmp, os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0), 0o666)
                break
            except FileExistsError:
                continue
            except OSError as exc:
                raise OutputPathError(
                    f"{what} '{target}': cannot create a file in directory '{folder}' ({exc.strerror or exc})") from None
        created = tmp
        try:
            fh = os.fdopen(fd, "wb")
        except BaseException:
            os.close(fd)
            raise
        on_created(tmp)
        blocked = False
        _restore_interrupts(old)  # a Ctrl-C held back arrives here or just after: cleaned below
        with fh:
            try:
                writer(fh)
                fh.flush()
                os.fsync(fh.fileno())
            except OSError as exc:
                raise OutputPathError(f"{what} '{target}': writing failed ({exc.strerror or exc})") from None
        try:  # an existing target keeps its permissions (and, where allowed, its owner)
            st = os.stat(real)
        except OSError:
            st = None
        if st is not None:
            os.chmod(tmp, stat.S_IMODE(st.st_mode))
            if hasattr(os, "chown"):
                try:
                    os.chown(tmp, st.st_uid, st.st_gid)
                except OSError:
                    pass
    except BaseException:
        if fh is not None and not fh.closed:
            try:
                fh.close()
            except OSError:
                pass
        if created is not None:
            _remove(created)
        raise
    finally:
        if blocked:
            _restore_interrupts(old)
    return tmp


def _remove(path: str) -> None:
    try:
        os.unlink(path)
    except OSError:
        pass


def _rename_into_place(item: _Staged) -> None:
    # Look again just before the rename: whatever appeared at the target meanwhile must
    # still be a regular file (or a link to one).
    real = _real_target(item.what, item.target)
    if real != item.real:
        raise OutputPathError(f"{item.what} '{item.target}': changed while colligate was writing it")
    try:
        os.replace(item.tmp, item.real)
    except OSError as exc:
        raise OutputPathError(f"{item.what} '{item.target}': cannot replace the file ({exc.strerror or exc})") from None


class OutputSet:
    """The output files of one command, written all together or not at all.

    >>> with OutputSet(inputs=[recipe_path]) as out:          # doctest: +SKIP
    ...     out.plan(plot_path, "--plot")                     # checks, before computing
    ...     out.plan(save_path, "--save")                     # refuses a second use of a path
    ...     report = compute()
    ...     out.write(plot_path, lambda fh: fig.savefig(fh, format="png"))
    ...     out.write_text(save_path, text)
    ...     out.commit()                                      # all renamed into place

    Leaving the ``with`` block without :meth:`commit` (an error, Ctrl-C) removes every
    temporary file, so no output appears. One object per command; not shared between
    threads.
    """

    def __init__(self, inputs: Iterable[Optional[str | os.PathLike[str]]] = ()) -> None:
        self._inputs = [os.fspath(p) for p in inputs if p is not None]
        self._planned: dict[str, tuple[str, str]] = {}  # real path -> (option, path as given)
        self._staged: list[_Staged] = []
        self._committed = False

    def _key(self, target: str) -> str:
        return os.path.normcase(os.path.realpath(target))

    def plan(self, path: str | os.PathLike[str], what: str = "output") -> str:
        """Check an output path now (see :func:`check_output_path`) and reserve it for
        ``what``; a second output on the same file is refused. Returns the path."""
        target = check_output_path(path, self._inputs, what)
        key = self._key(target)
        if key in self._planned:
            other, given = self._planned[key]
            raise OutputPathError(
                f"{what} '{target}' is the same file as {other} '{given}'; give each output its own file")
        for k, (other, given) in self._planned.items():
            if os.path.exists(target) and os.path.exists(k) and _same_file(target, k):
                raise OutputPathError(
                    f"{what} '{target}' is the same file as {other} '{given}'; give each output its own file")
        self._planned[key] = (what, target)
        return target

    def write(self, path: str | os.PathLike[str], writer: Callable[[IO[bytes]], None],
              what: Optional[str] = None) -> str:
        """Write one output to its temporary file now (renamed at :meth:`commit`).

        Messages name the option the path was planned for (else ``what``). Returns the path."""
        if self._committed:
            raise RuntimeError("OutputSet: already committed")
        target = os.fspath(path)
        key = self._key(target)
        if key in self._planned:  # the option it was planned for names it in messages
            what = self._planned[key][0]
        else:
            what = what or "output"
            self.plan(target, what)
        if any(self._key(s.target) == key for s in self._staged):
            raise OutputPathError(f"{what} '{target}': written twice by one command")
        target = check_output_path(target, self._inputs, what)
        real = _real_target(what, target)
        item = _Staged(target, real, "", what)

        def record(tmp: str) -> None:  # called with Ctrl-C held back (see _write_temporary)
            item.tmp = tmp
            self._staged.append(item)

        try:
            _write_temporary(target, real, writer, what, record)
        except BaseException:
            if item in self._staged:  # _write_temporary removed its file; removing again is harmless
                self._staged.remove(item)
                _remove(item.tmp)
            raise
        return target

    def write_text(self, path: str | os.PathLike[str], text: str, what: Optional[str] = None) -> str:
        """:meth:`write` for UTF-8 text."""
        data = text.encode("utf-8")
        return self.write(path, lambda fh: fh.write(data), what)

    def commit(self) -> list[str]:
        """Rename every written file into place; returns the paths. Ctrl-C is held back
        while the files are renamed, so it cannot leave some renamed and some not."""
        if self._committed:
            return [s.target for s in self._staged]
        old = _block_interrupts()
        try:
            for item in self._staged:  # look at every target before the first rename
                if _real_target(item.what, item.target) != item.real:
                    raise OutputPathError(f"{item.what} '{item.target}': changed while colligate was writing it")
            for item in self._staged:
                _rename_into_place(item)
            self._committed = True
        finally:
            _restore_interrupts(old)
        return [s.target for s in self._staged]

    def discard(self) -> None:
        """Remove the temporary files of outputs not yet committed."""
        if self._committed:
            return
        old = _block_interrupts()
        try:
            for item in self._staged:
                _remove(item.tmp)
            self._staged.clear()
        finally:
            _restore_interrupts(old)

    def __enter__(self) -> "OutputSet":
        return self

    def __exit__(self, *exc_info) -> None:
        self.discard()


def atomic_write(
    path: str | os.PathLike[str],
    writer: Callable[[IO[bytes]], None],
    inputs: Iterable[Optional[str | os.PathLike[str]]] = (),
    what: str = "output",
    *,
    into: Optional[OutputSet] = None,
) -> str:
    """Write a file atomically: ``writer`` fills a binary temporary file, which then
    replaces ``path`` (or, for a symbolic link, the regular file it points to).

    With ``into`` (an :class:`OutputSet`), the file is only written to its temporary
    file and renamed when the set is committed. Returns the path written. The temporary
    file is removed on any failure.
    """
    if into is not None:
        for src in inputs:  # the set knows its own inputs; these are checked too
            if src is not None and _same_file(os.fspath(path), os.fspath(src)):
                raise OutputPathError(f"{what} path '{os.fspath(path)}' is the input file; refusing to overwrite an input")
        return into.write(path, writer, what)
    with OutputSet(inputs) as out:
        out.plan(path, what)
        out.write(path, writer, what)
        out.commit()
    return os.fspath(path)


def atomic_write_text(
    path: str | os.PathLike[str],
    text: str,
    inputs: Iterable[Optional[str | os.PathLike[str]]] = (),
    what: str = "output",
    *,
    into: Optional[OutputSet] = None,
) -> str:
    """Write UTF-8 ``text`` to ``path`` atomically (see :func:`atomic_write`)."""
    data = text.encode("utf-8")
    return atomic_write(path, lambda fh: fh.write(data), inputs, what, into=into)
