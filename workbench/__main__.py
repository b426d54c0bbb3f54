"""``python -m workbench`` runs the same entry point as the ``workbench`` command."""

import sys

from .cli import main

sys.exit(main())
