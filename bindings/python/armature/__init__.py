"""armature: design of reinforced concrete one-way slab strips.

All engineering is done by the C++ kernel and its code plug-ins; this
package converts requests and results. A design aid: the results must be
checked and adopted by a qualified engineer under the codes that govern the
project, local rules first.
"""

from ._core import (  # noqa: F401
    CAUTION,
    DesignError,
    InputError,
    __version__,
    codes,
    design,
    design_many,
    plugin_failures,
)
from .tables import compare, to_frame  # noqa: F401

__all__ = [
    "CAUTION",
    "DesignError",
    "InputError",
    "codes",
    "compare",
    "design",
    "design_many",
    "plugin_failures",
    "to_frame",
]
