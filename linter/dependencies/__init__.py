"""Functional-dependency theory over attribute bitsets: pure functions, standard library only.

Attribute sets are ints (bit i = the i-th column of ``Attributes``); dependencies are ``FD``.
"""
from __future__ import annotations

from .attributes import Attributes
from .bcnf_decompose import bcnf_decompose
from .candidate_keys import KeySearch, candidate_keys, is_superkey, prime_attributes
from .chase_is_lossless import ChaseResult, chase_is_lossless
from .closure import ClosureIndex, closure
from .decomposition import Decomposition, Piece
from .derive import derive
from .fd import FD, fd_order, set_order
from .implies import equivalent, implies
from .minimal_cover import canonical_cover, minimal_cover
from .normal_form import NormalFormReport, Violation, normal_form
from .preserves_dependencies import preserves_dependencies
from .project import Projection, project
from .synthesize_3nf import synthesize_3nf

__all__ = [
    "FD",
    "Attributes",
    "ChaseResult",
    "ClosureIndex",
    "Decomposition",
    "KeySearch",
    "NormalFormReport",
    "Piece",
    "Projection",
    "Violation",
    "bcnf_decompose",
    "candidate_keys",
    "canonical_cover",
    "chase_is_lossless",
    "closure",
    "derive",
    "equivalent",
    "fd_order",
    "implies",
    "is_superkey",
    "minimal_cover",
    "normal_form",
    "preserves_dependencies",
    "prime_attributes",
    "project",
    "set_order",
    "synthesize_3nf",
]
