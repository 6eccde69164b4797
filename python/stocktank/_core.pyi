# Hand-written stubs of the compiled module stocktank._core, checked by mypy.stubtest.
# Each domain keeps its own section below; add new functions inside your domain's section.
from typing import Any, Dict, Tuple, Union, overload

import numpy as np
import numpy.typing as npt

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

def arps_rate(
    qi: ArrayLike, di: ArrayLike, b: ArrayLike, t: ArrayLike, *, d_min: ArrayLike | None = None, errors: str = "raise"
) -> FloatOrArray: ...
def arps_cumulative(
    qi: ArrayLike, di: ArrayLike, b: ArrayLike, t: ArrayLike, *, d_min: ArrayLike | None = None, errors: str = "raise"
) -> FloatOrArray: ...
def arps_time_to_rate(
    qi: ArrayLike,
    di: ArrayLike,
    b: ArrayLike,
    q_limit: ArrayLike,
    *,
    d_min: ArrayLike | None = None,
    errors: str = "raise",
) -> FloatOrArray: ...
def arps_eur(
    qi: ArrayLike,
    di: ArrayLike,
    b: ArrayLike,
    q_limit: ArrayLike,
    *,
    d_min: ArrayLike | None = None,
    t_max: ArrayLike | None = None,
    errors: str = "raise",
) -> FloatOrArray: ...
def effective_decline(
    d_nominal_per_year: ArrayLike, b: ArrayLike, *, period: str = "year", errors: str = "raise"
) -> FloatOrArray: ...
def nominal_decline(d_effective: ArrayLike, b: ArrayLike, *, period: str = "year", errors: str = "raise") -> FloatOrArray: ...
def fit_decline_batch(
    t: ArrayLike,
    q: ArrayLike,
    offsets: ArrayLike,
    start_time: ArrayLike | None = None,
    *,
    loss: str = "soft_l1",
    f_scale: float = 0.2,
    b_min: float = 0.0,
    b_max: float = 2.0,
    di_min: float = 1e-3,
    di_max: float = 50.0,
    start: str = "peak",
    min_points: int = 6,
    q_limit: float = 1.0,
    d_min: float = 0.0,
    horizon_years: float = 50.0,
    n_bootstrap: int = 100,
    seed: int = 0,
    max_iter: int = 200,
    tol: float = 1e-8,
) -> Dict[str, Any]: ...
def forecast_batch(
    qi: ArrayLike,
    di: ArrayLike,
    b: ArrayLike,
    t_from: ArrayLike,
    t_max: ArrayLike,
    *,
    d_min: float = 0.0,
    q_limit: float = 1.0,
    step_days: float | None = None,
) -> Dict[str, npt.NDArray[Any]]: ...


# ---- volumetrics ---------------------------------------------------------------------------


# ---- units ---------------------------------------------------------------------------------


# ---- end -----------------------------------------------------------------------------------
