"""``python -m survey`` runs the same command line as the ``survey`` script."""

import sys

from survey.cli import main

sys.exit(main())
