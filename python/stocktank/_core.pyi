# Hand-written stubs of the compiled module stocktank._core, checked by mypy.stubtest.
# Each domain keeps its own section below; add new functions inside your domain's section.
from typing import Any, Dict, List, Optional, Sequence, Tuple, Union, final, overload

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

@final
class PvtTable:
    def __new__(
        cls,
        *,
        p: ArrayLike,
        bo: ArrayLike,
        rs: ArrayLike,
        bg: ArrayLike,
        bw: Optional[ArrayLike] = None,
        mu_o: Optional[ArrayLike] = None,
        mu_g: Optional[ArrayLike] = None,
    ) -> PvtTable: ...
    @property
    def p(self) -> npt.NDArray[np.float64]: ...
    @property
    def bo(self) -> npt.NDArray[np.float64]: ...
    @property
    def rs(self) -> npt.NDArray[np.float64]: ...
    @property
    def bg(self) -> npt.NDArray[np.float64]: ...
    @property
    def bw(self) -> Optional[npt.NDArray[np.float64]]: ...
    @property
    def mu_o(self) -> Optional[npt.NDArray[np.float64]]: ...
    @property
    def mu_g(self) -> Optional[npt.NDArray[np.float64]]: ...
    def at(self, p: ArrayLike, *, errors: str = "raise") -> Dict[str, FloatOrArray]: ...
    def bt(self, p: ArrayLike, *, p_initial: float, errors: str = "raise") -> FloatOrArray: ...
    def __reduce__(self) -> Tuple[Any, Tuple[Any, Dict[str, Any]], None]: ...

@final
class Aquifer:
    def __new__(
        cls,
        *,
        model: str,
        constant: float = 1.0,
        tau_days: Optional[float] = None,
        td_per_day: Optional[float] = None,
        red: float = ...,
    ) -> Aquifer: ...
    @staticmethod
    def fetkovich(*, wei_rb: float, j: float, p_initial: float) -> Aquifer: ...
    @property
    def model(self) -> str: ...
    @property
    def constant(self) -> float: ...
    @property
    def tau_days(self) -> Optional[float]: ...
    @property
    def td_per_day(self) -> Optional[float]: ...
    @property
    def red(self) -> Optional[float]: ...
    def influx(self, t_days: ArrayLike, p: ArrayLike, *, p_initial: float) -> npt.NDArray[np.float64]: ...
    def __reduce__(self) -> Tuple[Any, Tuple[Any, Dict[str, Any]], None]: ...

def veh_dimensionless_influx(td: ArrayLike, *, red: float = ..., errors: str = "raise") -> FloatOrArray: ...
def veh_dimensionless_pressure(td: ArrayLike, *, red: float = ..., errors: str = "raise") -> FloatOrArray: ...
def veh_constants(
    *,
    k_md: float,
    phi: float,
    mu_cp: float,
    ct_per_psi: float,
    h_ft: float,
    ro_ft: float,
    theta_deg: float = 360.0,
) -> Tuple[float, float]: ...
def fetkovich_j_radial(
    *, k_md: float, h_ft: float, mu_cp: float, ra_ft: float, ro_ft: float, theta_deg: float = 360.0
) -> float: ...
def fetkovich_j_linear(*, k_md: float, w_ft: float, h_ft: float, mu_cp: float, l_ft: float) -> float: ...
def gas_bg(
    p: ArrayLike,
    z: ArrayLike,
    *,
    temperature_f: float,
    p_sc: float = 14.696,
    t_sc: float = 60.0,
    errors: str = "raise",
) -> FloatOrArray: ...
def oil_mbe_terms(
    pvt: PvtTable,
    *,
    t_days: ArrayLike,
    p: ArrayLike,
    np_stb: ArrayLike,
    gp_scf: ArrayLike,
    wp_stb: Optional[ArrayLike] = None,
    wi_stb: Optional[ArrayLike] = None,
    gi_scf: Optional[ArrayLike] = None,
    p_initial: float,
    swi: float = 0.0,
    cw: float = 0.0,
    cf: float = 0.0,
    m: float = 0.0,
) -> Dict[str, Any]: ...
def havlena_odeh_fit(
    pvt: PvtTable,
    *,
    t_days: ArrayLike,
    p: ArrayLike,
    np_stb: ArrayLike,
    gp_scf: ArrayLike,
    wp_stb: Optional[ArrayLike] = None,
    wi_stb: Optional[ArrayLike] = None,
    gi_scf: Optional[ArrayLike] = None,
    p_initial: float,
    swi: float = 0.0,
    cw: float = 0.0,
    cf: float = 0.0,
    case: str = "volumetric",
    m: float = 0.0,
    aquifer: Optional[Aquifer] = None,
    select: Optional[Sequence[bool]] = None,
) -> Dict[str, Any]: ...
def campbell_plot(
    pvt: PvtTable,
    *,
    t_days: ArrayLike,
    p: ArrayLike,
    np_stb: ArrayLike,
    gp_scf: ArrayLike,
    wp_stb: Optional[ArrayLike] = None,
    wi_stb: Optional[ArrayLike] = None,
    gi_scf: Optional[ArrayLike] = None,
    p_initial: float,
    swi: float = 0.0,
    cw: float = 0.0,
    cf: float = 0.0,
    m: float = 0.0,
) -> Dict[str, Any]: ...
def drive_indices(
    pvt: PvtTable,
    *,
    t_days: ArrayLike,
    p: ArrayLike,
    np_stb: ArrayLike,
    gp_scf: ArrayLike,
    wp_stb: Optional[ArrayLike] = None,
    wi_stb: Optional[ArrayLike] = None,
    gi_scf: Optional[ArrayLike] = None,
    p_initial: float,
    swi: float = 0.0,
    cw: float = 0.0,
    cf: float = 0.0,
    n: float,
    m: float = 0.0,
    we: Optional[ArrayLike] = None,
) -> Dict[str, Any]: ...
def classify_drive(
    pvt: PvtTable,
    *,
    t_days: ArrayLike,
    p: ArrayLike,
    np_stb: ArrayLike,
    gp_scf: ArrayLike,
    wp_stb: Optional[ArrayLike] = None,
    wi_stb: Optional[ArrayLike] = None,
    gi_scf: Optional[ArrayLike] = None,
    p_initial: float,
    swi: float = 0.0,
    cw: float = 0.0,
    cf: float = 0.0,
    m: float = 0.0,
    tolerance: float = 0.05,
) -> Dict[str, Any]: ...
def history_match(
    pvt: PvtTable,
    *,
    t_days: ArrayLike,
    p: ArrayLike,
    np_stb: ArrayLike,
    gp_scf: ArrayLike,
    wp_stb: Optional[ArrayLike] = None,
    wi_stb: Optional[ArrayLike] = None,
    gi_scf: Optional[ArrayLike] = None,
    p_initial: float,
    swi: float = 0.0,
    cw: float = 0.0,
    cf: float = 0.0,
    m: Optional[float] = None,
    aquifer: Optional[Aquifer] = None,
    fit_shape: bool = True,
    fit_red: bool = False,
    objective: str = "pressure",
    max_iterations: int = 100,
    tolerance: float = 1e-10,
    confidence: float = 0.95,
) -> Dict[str, Any]: ...
def history_match_batch(
    pvts: Sequence[PvtTable],
    histories: Sequence[Dict[str, Any]],
    *,
    p_initial: Sequence[float],
    swi: Sequence[float],
    cw: Sequence[float],
    cf: Sequence[float],
    m: Optional[float] = None,
    aquifer: Optional[Aquifer] = None,
    fit_shape: bool = True,
    fit_red: bool = False,
    objective: str = "pressure",
    max_iterations: int = 100,
    tolerance: float = 1e-10,
    confidence: float = 0.95,
    errors: str = "raise",
) -> List[Any]: ...
def pz_fit(
    *,
    gp_scf: ArrayLike,
    p: ArrayLike,
    z: ArrayLike,
    select: Optional[Sequence[bool]] = None,
    pz_abandon: Optional[float] = None,
) -> Dict[str, Any]: ...
def pz_fit_abnormal(
    *,
    gp_scf: ArrayLike,
    p: ArrayLike,
    z: ArrayLike,
    p_initial: float,
    swi: float,
    cw: float,
    cf: float,
    select: Optional[Sequence[bool]] = None,
    p_abandon: Optional[float] = None,
    z_abandon: Optional[float] = None,
) -> Dict[str, Any]: ...
def cole_plot(
    *,
    gp_scf: ArrayLike,
    p: ArrayLike,
    z: ArrayLike,
    p_initial: float,
    z_initial: float,
    temperature_f: float,
    wp_stb: Optional[ArrayLike] = None,
    bw: float = 1.0,
    p_sc: float = 14.696,
    t_sc: float = 60.0,
) -> npt.NDArray[np.float64]: ...
def gas_water_drive_fit(
    *,
    t_days: ArrayLike,
    gp_scf: ArrayLike,
    p: ArrayLike,
    z: ArrayLike,
    p_initial: float,
    z_initial: float,
    temperature_f: float,
    aquifer: Aquifer,
    wp_stb: Optional[ArrayLike] = None,
    bw: float = 1.0,
    p_sc: float = 14.696,
    t_sc: float = 60.0,
    select: Optional[Sequence[bool]] = None,
) -> Dict[str, Any]: ...
def muskat_forecast(
    pvt: PvtTable,
    relperm: CoreyGasOil,
    *,
    p_bubble: float,
    p_end: float,
    n_steps: int = 100,
) -> Dict[str, Any]: ...


# ---- decline -------------------------------------------------------------------------------


# ---- volumetrics ---------------------------------------------------------------------------


# ---- units ---------------------------------------------------------------------------------


# ---- end -----------------------------------------------------------------------------------
