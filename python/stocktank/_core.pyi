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

@final
class Water:
    def __new__(
        cls,
        *,
        salinity_wt_pct: float = 0.0,
        gas_saturated: bool = True,
        viscosity_method: str = "meehan",
        p_sc: float = 14.696,
        t_sc: float = 60.0,
    ) -> Water: ...
    @property
    def salinity_wt_pct(self) -> float: ...
    @property
    def gas_saturated(self) -> bool: ...
    @property
    def viscosity_method(self) -> str: ...
    @property
    def p_sc(self) -> float: ...
    @property
    def t_sc(self) -> float: ...
    def bw(self, p: ArrayLike, t: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def rsw(self, p: ArrayLike, t: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def density(self, p: ArrayLike, t: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def compressibility(
        self, p: ArrayLike, t: ArrayLike, *, errors: str = "raise"
    ) -> FloatOrArray: ...
    def viscosity(self, p: ArrayLike, t: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def compressibility_with_gas_release(
        self, p: ArrayLike, t: ArrayLike, bg_rb_per_scf: ArrayLike, *, errors: str = "raise"
    ) -> FloatOrArray: ...
    def in_range(self, p: ArrayLike, t: ArrayLike) -> Union[bool, npt.NDArray[np.bool_]]: ...
    def __reduce__(self) -> Tuple[Any, Tuple[Any, Dict[str, Any]], None]: ...

def water_bw(
    p: ArrayLike, t: ArrayLike, *, p_sc: float = 14.696, t_sc: float = 60.0, errors: str = "raise"
) -> FloatOrArray: ...
def water_density(
    p: ArrayLike, t: ArrayLike, salinity_wt_pct: ArrayLike, *, errors: str = "raise"
) -> FloatOrArray: ...
def water_density_sc(salinity_wt_pct: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def water_rsw(
    p: ArrayLike, t: ArrayLike, salinity_wt_pct: ArrayLike, *, errors: str = "raise"
) -> FloatOrArray: ...
def water_compressibility(
    p: ArrayLike,
    t: ArrayLike,
    salinity_wt_pct: ArrayLike,
    *,
    gas_saturated: bool = False,
    errors: str = "raise",
) -> FloatOrArray: ...
def water_compressibility_with_gas_release(
    p: ArrayLike,
    t: ArrayLike,
    salinity_wt_pct: ArrayLike,
    bg_rb_per_scf: ArrayLike,
    *,
    p_sc: float = 14.696,
    t_sc: float = 60.0,
    errors: str = "raise",
) -> FloatOrArray: ...
def water_viscosity(
    p: ArrayLike,
    t: ArrayLike,
    salinity_wt_pct: ArrayLike,
    *,
    method: str = "meehan",
    errors: str = "raise",
) -> FloatOrArray: ...
def salinity_ppm_to_wt_pct(ppm: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def salinity_wt_pct_to_ppm(salinity_wt_pct: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def salinity_mg_per_l_to_wt_pct(mg_per_l: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def water_bw_in_range(p: ArrayLike, t: ArrayLike) -> Union[bool, npt.NDArray[np.bool_]]: ...
def water_density_sc_in_range(salinity_wt_pct: ArrayLike) -> Union[bool, npt.NDArray[np.bool_]]: ...
def water_rsw_in_range(
    p: ArrayLike, t: ArrayLike, salinity_wt_pct: ArrayLike
) -> Union[bool, npt.NDArray[np.bool_]]: ...
def water_compressibility_in_range(
    p: ArrayLike, t: ArrayLike, salinity_wt_pct: ArrayLike
) -> Union[bool, npt.NDArray[np.bool_]]: ...
def water_viscosity_in_range(
    p: ArrayLike, t: ArrayLike, salinity_wt_pct: ArrayLike, *, method: str = "meehan"
) -> Union[bool, npt.NDArray[np.bool_]]: ...

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
def arps_rate_at_cumulative(
    qi: ArrayLike, di: ArrayLike, b: ArrayLike, np: ArrayLike, *, d_min: ArrayLike | None = None, errors: str = "raise"
) -> FloatOrArray: ...
def arps_remaining(
    qi: ArrayLike,
    di: ArrayLike,
    b: ArrayLike,
    t_from: ArrayLike,
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
