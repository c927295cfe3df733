"""``python -m colligate``: the same program as the ``colligate`` command.

It runs through the same launcher (Ctrl-C and SIGTERM handling, see ``_colligate_cli``);
only a Ctrl-C while Python imports the package itself, before this file runs, is beyond
its reach.
"""

import sys

from _colligate_cli import main

sys.exit(main())
