"""armature: design of reinforced concrete one-way slab strips.

All engineering is done by the C++ kernel and its code plug-ins; this
package converts requests and results.

`armature.CAUTION` (from the kernel, the one place it is written) travels
with every result: the result's "caution", the record and summary, the
DataFrames' ``attrs["caution"]`` and a footnote on every plot.
"""

import os

from . import _core
from ._core import CAUTION, DesignError, InputError, __version__, codes, plugin_failures  # noqa: F401


class Result(dict):
    """A design result: a dict with the contract's keys that also keeps the
    request it came from (`result.request`), so that its calculation record
    can be written later."""

    __slots__ = ("request",)  # no per-result __dict__

    def __init__(self, data=(), request=None):
        super().__init__(data)
        self.request = request


_core._set_result_type(Result)


def design(request):
    """Design one slab strip; returns the result (a dict, see contract.md)."""
    return _core.design(request)


def design_many(requests, threads=0):
    """Design many requests on `threads` threads (0: all cores), the GIL
    released; results in the order of the requests."""
    return _core.design_many(list(requests), threads)


def report(result, path):
    """Write the calculation record of `result` to `path` (.html or .md),
    atomically. Returns the path."""
    request = getattr(result, "request", None)
    if request is None:
        raise ValueError("report needs a result returned by armature.design (it keeps its request)")
    return _core.write_record(request, os.fspath(path), dict(result))


from .plots import add_caution, plot_envelopes, plot_plan, plot_plate, plot_study  # noqa: E402,F401
from .studies import Optimum, optimise, request_for, sweep  # noqa: E402,F401
from .tables import compare, schedule, to_frame  # noqa: E402,F401

__all__ = [
    "CAUTION",
    "add_caution",
    "DesignError",
    "InputError",
    "Optimum",
    "optimise",
    "codes",
    "compare",
    "design",
    "design_many",
    "plot_envelopes",
    "plot_plan",
    "plot_plate",
    "plot_study",
    "plugin_failures",
    "report",
    "schedule",
    "request_for",
    "Result",
    "sweep",
    "to_frame",
]
