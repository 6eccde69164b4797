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

from typing import List as _List, Optional as _Optional, Sequence as _Sequence

@final
class Oil:
    def __new__(
        cls,
        *,
        api: float,
        gas_sg: float,
        temperature_f: float,
        gor: _Optional[float] = None,
        pb: _Optional[float] = None,
        bob: _Optional[float] = None,
        mu_ob: _Optional[float] = None,
        pb_method: str = "standing",
        bo_method: str = "standing",
        co_method: str = "vasquez_beggs",
        dead_oil_viscosity_method: str = "beggs_robinson",
        separator_p: _Optional[float] = None,
        separator_t: _Optional[float] = None,
        salinity_wt_pct: float = 0.0,
        p_sc: float = 14.696,
        t_sc: float = 60.0,
    ) -> Oil: ...
    @property
    def api(self) -> float: ...
    @property
    def gas_sg(self) -> float: ...
    @property
    def temperature_f(self) -> float: ...
    @property
    def gor(self) -> _Optional[float]: ...
    @property
    def pb(self) -> _Optional[float]: ...
    @property
    def bob(self) -> _Optional[float]: ...
    @property
    def mu_ob(self) -> _Optional[float]: ...
    @property
    def pb_method(self) -> str: ...
    @property
    def bo_method(self) -> str: ...
    @property
    def co_method(self) -> str: ...
    @property
    def dead_oil_viscosity_method(self) -> str: ...
    @property
    def separator_p(self) -> _Optional[float]: ...
    @property
    def separator_t(self) -> _Optional[float]: ...
    @property
    def salinity_wt_pct(self) -> float: ...
    @property
    def p_sc(self) -> float: ...
    @property
    def t_sc(self) -> float: ...
    def bubble_point(self) -> float: ...
    def rsi(self) -> float: ...
    def calibration_report(self) -> Dict[str, float]: ...
    def rs(self, p: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def bo(self, p: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def viscosity(self, p: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def table(self, p: _Sequence[float]) -> Dict[str, npt.NDArray[Any]]: ...
    def check_table(self, p: _Sequence[float]) -> _List[Tuple[float, str, str]]: ...
    def __reduce__(self) -> Tuple[Any, Tuple[Any, Dict[str, Any]], None]: ...

def sg_from_api(api: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def api_from_sg(oil_sg: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def oil_molar_mass(api: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def bubble_point(
    rs: ArrayLike,
    gas_sg: ArrayLike,
    api: ArrayLike,
    temperature_f: ArrayLike,
    *,
    method: str = "standing",
    errors: str = "raise",
) -> FloatOrArray: ...
def solution_gor(
    p: ArrayLike,
    gas_sg: ArrayLike,
    api: ArrayLike,
    temperature_f: ArrayLike,
    *,
    method: str = "standing",
    errors: str = "raise",
) -> FloatOrArray: ...
def bubble_point_in_range(
    rs: ArrayLike,
    gas_sg: ArrayLike,
    api: ArrayLike,
    temperature_f: ArrayLike,
    *,
    method: str = "standing",
) -> FloatOrArray: ...
def bo_saturated_in_range(
    rs: ArrayLike,
    gas_sg: ArrayLike,
    api: ArrayLike,
    temperature_f: ArrayLike,
    *,
    method: str = "standing",
) -> FloatOrArray: ...
def dead_oil_viscosity_in_range(
    api: ArrayLike, temperature_f: ArrayLike, *, method: str = "beggs_robinson"
) -> FloatOrArray: ...
def vasquez_beggs_gas_sg_100psig(
    gas_sg: ArrayLike,
    api: ArrayLike,
    separator_t: ArrayLike,
    separator_p: ArrayLike,
    *,
    errors: str = "raise",
) -> FloatOrArray: ...
def bo_saturated(
    rs: ArrayLike,
    gas_sg: ArrayLike,
    api: ArrayLike,
    temperature_f: ArrayLike,
    *,
    method: str = "standing",
    errors: str = "raise",
) -> FloatOrArray: ...
def co_undersaturated(
    p: ArrayLike,
    rsb: ArrayLike,
    gas_sg: ArrayLike,
    api: ArrayLike,
    temperature_f: ArrayLike,
    *,
    method: str = "vasquez_beggs",
    errors: str = "raise",
) -> FloatOrArray: ...
def bo_undersaturated(
    p: ArrayLike,
    pb: ArrayLike,
    bob: ArrayLike,
    rsb: ArrayLike,
    gas_sg: ArrayLike,
    api: ArrayLike,
    temperature_f: ArrayLike,
    *,
    method: str = "vasquez_beggs",
    errors: str = "raise",
) -> FloatOrArray: ...
def apparent_compressibility(
    bo: ArrayLike,
    dbo_dp: ArrayLike,
    bg_rb_per_scf: ArrayLike,
    drs_dp: ArrayLike,
    *,
    errors: str = "raise",
) -> FloatOrArray: ...
def total_fvf(
    bo: ArrayLike,
    bg_rb_per_scf: ArrayLike,
    rsi: ArrayLike,
    rs: ArrayLike,
    *,
    errors: str = "raise",
) -> FloatOrArray: ...
def oil_density(
    rs: ArrayLike,
    bo: ArrayLike,
    gas_sg: ArrayLike,
    api: ArrayLike,
    *,
    p_sc: float = 14.696,
    t_sc: float = 60.0,
    errors: str = "raise",
) -> FloatOrArray: ...
def dead_oil_viscosity(
    api: ArrayLike,
    temperature_f: ArrayLike,
    *,
    method: str = "beggs_robinson",
    errors: str = "raise",
) -> FloatOrArray: ...
def live_oil_viscosity(mu_od: ArrayLike, rs: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def undersaturated_oil_viscosity(
    p: ArrayLike, pb: ArrayLike, mu_ob: ArrayLike, *, errors: str = "raise"
) -> FloatOrArray: ...
def black_oil_tables(
    p: _Sequence[float],
    api: ArrayLike,
    gas_sg: ArrayLike,
    temperature_f: ArrayLike,
    *,
    gor: _Optional[ArrayLike] = None,
    pb: _Optional[ArrayLike] = None,
    bob: _Optional[ArrayLike] = None,
    mu_ob: _Optional[ArrayLike] = None,
    separator_p: _Optional[ArrayLike] = None,
    separator_t: _Optional[ArrayLike] = None,
    salinity_wt_pct: _Optional[ArrayLike] = None,
    pb_method: str = "standing",
    bo_method: str = "standing",
    co_method: str = "vasquez_beggs",
    dead_oil_viscosity_method: str = "beggs_robinson",
    p_sc: float = 14.696,
    t_sc: float = 60.0,
    errors: str = "raise",
) -> Dict[str, Any]: ...
def table_columns() -> _List[Tuple[str, str]]: ...


# ---- water ---------------------------------------------------------------------------------


# ---- material_balance ----------------------------------------------------------------------


# ---- decline -------------------------------------------------------------------------------


# ---- volumetrics ---------------------------------------------------------------------------


# ---- units ---------------------------------------------------------------------------------


# ---- end -----------------------------------------------------------------------------------
