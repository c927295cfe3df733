"""``python -m colligate``: the same program as the ``colligate`` command."""

import sys

from .cli import main

sys.exit(main())
