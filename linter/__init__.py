"""normguard: keeps relational schemas normalized, one migration at a time."""
from __future__ import annotations

__version__ = "0.1.0"
