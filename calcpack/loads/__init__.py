"""Load types, resultants and load cases.

Sign convention: x from the left end of the beam; transverse forces and line loads positive
downward (gravity); axial components positive toward +x; couples positive clockwise.
"""

from calcpack.loads.resultants import Resultant, resultant
from calcpack.loads.types import (
    AreaLoad,
    DistributedLoad,
    FunctionLoad,
    LinearLoad,
    Load,
    PointLoad,
    PointMoment,
    PolynomialLoad,
    UniformLoad,
    as_loads,
)

__all__ = [
    "AreaLoad",
    "DistributedLoad",
    "FunctionLoad",
    "LinearLoad",
    "Load",
    "PointLoad",
    "PointMoment",
    "PolynomialLoad",
    "Resultant",
    "UniformLoad",
    "as_loads",
    "resultant",
]
