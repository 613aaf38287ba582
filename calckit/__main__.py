"""``python -m calckit run|demo|verify|check ...``: see :mod:`calckit.cli` for options and exit codes."""
import sys

from .cli import main

sys.exit(main())
