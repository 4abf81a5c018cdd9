"""The ``normguard`` command line: one module per command, grouped in ``linter.cli.main``."""
