"""Subcommands of the ``survey`` command line (a face: may use Rich and pint)."""
