# Hand-written stubs of the compiled module stocktank._core, checked by mypy.stubtest.
# Each domain keeps its own section below; add new functions inside your domain's section.
from typing import Any, Dict, Tuple, Union, overload

import numpy as np
import numpy.typing as npt
from typing_extensions import final

__version__: str

ArrayLike = npt.ArrayLike
FloatOrArray = Union[float, npt.NDArray[np.float64]]

class StocktankError(ValueError): ...
class InvalidArgumentError(StocktankError): ...
class ShapeError(StocktankError): ...
class InvalidOptionError(StocktankError): ...
class InvalidRecordError(StocktankError): ...
class ConvergenceError(StocktankError): ...
class SingularError(StocktankError): ...
class OutOfRangeError(StocktankError): ...

# ---- relperm -------------------------------------------------------------------------------

@final
class CoreyOilWater:
    def __new__(
        cls,
        *,
        swc: float,
        sorw: float,
        krw_max: float = 1.0,
        kro_max: float = 1.0,
        nw: float = 2.0,
        no: float = 2.0,
    ) -> CoreyOilWater: ...
    @property
    def swc(self) -> float: ...
    @property
    def sorw(self) -> float: ...
    @property
    def krw_max(self) -> float: ...
    @property
    def kro_max(self) -> float: ...
    @property
    def nw(self) -> float: ...
    @property
    def no(self) -> float: ...
    def krw(self, sw: ArrayLike) -> FloatOrArray: ...
    def krow(self, sw: ArrayLike) -> FloatOrArray: ...
    def __reduce__(self) -> Tuple[Any, Tuple[Any, Dict[str, float]], None]: ...

@final
class CoreyGasOil:
    def __new__(
        cls,
        *,
        swc: float,
        sgc: float,
        sorg: float,
        krg_max: float = 1.0,
        kro_max: float = 1.0,
        ng: float = 2.0,
        no: float = 2.0,
    ) -> CoreyGasOil: ...
    @property
    def swc(self) -> float: ...
    @property
    def sgc(self) -> float: ...
    @property
    def sorg(self) -> float: ...
    @property
    def krg_max(self) -> float: ...
    @property
    def kro_max(self) -> float: ...
    @property
    def ng(self) -> float: ...
    @property
    def no(self) -> float: ...
    def krg(self, sg: ArrayLike) -> FloatOrArray: ...
    def krog(self, sg: ArrayLike) -> FloatOrArray: ...
    def krg_over_kro(self, sg: ArrayLike) -> FloatOrArray: ...
    def __reduce__(self) -> Tuple[Any, Tuple[Any, Dict[str, float]], None]: ...

# ---- gas -----------------------------------------------------------------------------------


# ---- oil -----------------------------------------------------------------------------------


# ---- water ---------------------------------------------------------------------------------


# ---- material_balance ----------------------------------------------------------------------


# ---- decline -------------------------------------------------------------------------------


# ---- volumetrics ---------------------------------------------------------------------------


# ---- units ---------------------------------------------------------------------------------


# ---- end -----------------------------------------------------------------------------------
