"""Launcher of the ``colligate`` command.

The command's entry point lives outside the ``colligate`` package on purpose: importing
``colligate`` loads the compiled core, numpy and pandas, which takes a moment, and a
Ctrl-C during that moment must end with the same one-line message and exit status 130
as a Ctrl-C later on, not with a traceback. This module imports nothing heavy until
:func:`main` runs, inside the handler.
"""

import signal
import sys

EXIT_INTERRUPTED = 130  # 128 + SIGINT; the same value as colligate.cli.EXIT_INTERRUPTED


def _terminated(signum, frame):
    # SIGTERM (kill, a stopping service) unwinds like Ctrl-C, so temporary files are
    # removed and no partial output stays; the status is 128 + the signal number.
    raise SystemExit(128 + signum)


def _import_held_back():
    """Import the command with Ctrl-C held back, then deliver it. A KeyboardInterrupt raised
    inside the import machinery or an extension module's initialisation (numpy, the compiled
    core) can leave a half-made module behind: CPython then prints "Exception ignored"
    tracebacks or aborts while shutting down. Held back, a Ctrl-C typed during the import
    (about a second) ends the command right after it, with the usual one line."""
    pending = []
    old = signal.getsignal(signal.SIGINT)
    holding = callable(old)
    if holding:
        signal.signal(signal.SIGINT, lambda signum, frame: pending.append((signum, frame)))
    try:
        from colligate.cli import main as run
    finally:
        if holding:
            signal.signal(signal.SIGINT, old)
    if pending:
        old(*pending[0])  # the default handler raises KeyboardInterrupt here
    return run


def main() -> int:
    """Run ``colligate`` (see :mod:`colligate.cli`); returns the exit status."""
    if hasattr(signal, "SIGTERM"):
        signal.signal(signal.SIGTERM, _terminated)
    try:
        try:
            run = _import_held_back()
            status = run()
        finally:
            # Done (or stopped): from here on a Ctrl-C could only interrupt the
            # interpreter's teardown and end the process by the signal, so it is ignored.
            signal.signal(signal.SIGINT, signal.SIG_IGN)
            if hasattr(signal, "SIGTERM"):
                signal.signal(signal.SIGTERM, signal.SIG_DFL)
    except KeyboardInterrupt:
        try:
            sys.stderr.write("colligate: interrupted\n")
            sys.stderr.flush()
        except Exception:  # stderr closed: nothing more to say
            pass
        status = EXIT_INTERRUPTED
    return status
