# Hand-written stubs of the compiled module stocktank._core, checked by mypy.stubtest.
# Each domain keeps its own section below; add new functions inside your domain's section.
from typing import Any, Dict, List, Optional, Sequence, Tuple, Union, final, overload

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

def set_num_threads(n: Optional[int]) -> Optional[int]: ...
def get_num_threads() -> int: ...

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

from typing import final as _final

def z_factor(ppr: ArrayLike, tpr: ArrayLike, *, method: str = "dak", errors: str = "raise") -> FloatOrArray: ...
def pseudo_reduced_compressibility(
    ppr: ArrayLike, tpr: ArrayLike, *, method: str = "dak", errors: str = "raise"
) -> FloatOrArray: ...
def z_factor_in_range(ppr: ArrayLike, tpr: ArrayLike, *, method: str = "dak") -> Union[bool, npt.NDArray[np.bool_]]: ...
def pseudo_critical(
    gas_sg: ArrayLike, *, method: str = "sutton", errors: str = "raise"
) -> Tuple[FloatOrArray, FloatOrArray]: ...
def pseudo_critical_in_range(gas_sg: ArrayLike, *, method: str = "sutton") -> Union[bool, npt.NDArray[np.bool_]]: ...
def wichert_aziz(
    tpc_r: ArrayLike, ppc_psia: ArrayLike, co2: ArrayLike, h2s: ArrayLike, *, errors: str = "raise"
) -> Tuple[FloatOrArray, FloatOrArray]: ...
def pseudo_critical_kay(
    *,
    n2: Union[ArrayLike, None] = None,
    co2: Union[ArrayLike, None] = None,
    h2s: Union[ArrayLike, None] = None,
    c1: Union[ArrayLike, None] = None,
    c2: Union[ArrayLike, None] = None,
    c3: Union[ArrayLike, None] = None,
    ic4: Union[ArrayLike, None] = None,
    nc4: Union[ArrayLike, None] = None,
    ic5: Union[ArrayLike, None] = None,
    nc5: Union[ArrayLike, None] = None,
    c6: Union[ArrayLike, None] = None,
    c7plus: Union[ArrayLike, None] = None,
    c7plus_mw: Union[ArrayLike, None] = None,
    c7plus_sg: Union[ArrayLike, None] = None,
    errors: str = "raise",
) -> Tuple[FloatOrArray, FloatOrArray, FloatOrArray]: ...
def bg(
    p_psia: ArrayLike, t_f: ArrayLike, z: ArrayLike, *, p_sc: float = 14.696, t_sc: float = 60.0, errors: str = "raise"
) -> FloatOrArray: ...
def gas_density(
    p_psia: ArrayLike, t_f: ArrayLike, z: ArrayLike, gas_sg: ArrayLike, *, errors: str = "raise"
) -> FloatOrArray: ...
def viscosity_lee_gonzalez_eakin(
    t_f: ArrayLike, density_lbm_ft3: ArrayLike, molar_mass: ArrayLike, *, errors: str = "raise"
) -> FloatOrArray: ...
def recombined_gas_sg(
    separator_gor: ArrayLike,
    separator_gas_sg: ArrayLike,
    condensate_api: ArrayLike,
    *,
    stock_tank_gor: Union[ArrayLike, None] = None,
    stock_tank_gas_sg: Union[ArrayLike, None] = None,
    condensate_mw: Union[ArrayLike, None] = None,
    p_sc: float = 14.696,
    t_sc: float = 60.0,
    errors: str = "raise",
) -> FloatOrArray: ...
def gas_equivalent(
    condensate_sg: ArrayLike, condensate_mw: ArrayLike, *, p_sc: float = 14.696, t_sc: float = 60.0, errors: str = "raise"
) -> FloatOrArray: ...
def condensate_molar_mass(condensate_api: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...

@_final
class Gas:
    def __new__(
        cls,
        gas_sg: float,
        *,
        co2: float = 0.0,
        h2s: float = 0.0,
        n2: float = 0.0,
        pseudo_critical: Union[str, None] = "sutton",
        impurity_correction: str = "wichert_aziz",
        tpc_r: Union[float, None] = None,
        ppc_psia: Union[float, None] = None,
        z_method: str = "dak",
        viscosity_method: str = "lee_gonzalez_eakin",
    ) -> Gas: ...
    @staticmethod
    def from_composition(
        *,
        n2: float = 0.0,
        co2: float = 0.0,
        h2s: float = 0.0,
        c1: float = 0.0,
        c2: float = 0.0,
        c3: float = 0.0,
        ic4: float = 0.0,
        nc4: float = 0.0,
        ic5: float = 0.0,
        nc5: float = 0.0,
        c6: float = 0.0,
        c7plus: float = 0.0,
        c7plus_mw: float = 0.0,
        c7plus_sg: float = 0.0,
        z_method: str = "dak",
        viscosity_method: str = "lee_gonzalez_eakin",
    ) -> Gas: ...
    @property
    def gas_sg(self) -> float: ...
    @property
    def co2(self) -> float: ...
    @property
    def h2s(self) -> float: ...
    @property
    def n2(self) -> float: ...
    @property
    def pseudo_critical(self) -> Union[str, None]: ...
    @property
    def impurity_correction(self) -> str: ...
    @property
    def z_method(self) -> str: ...
    @property
    def viscosity_method(self) -> str: ...
    @property
    def tpc_r(self) -> float: ...
    @property
    def ppc_psia(self) -> float: ...
    @property
    def molar_mass(self) -> float: ...
    def z(self, p_psia: ArrayLike, t_f: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def bg(
        self, p_psia: ArrayLike, t_f: ArrayLike, *, p_sc: float = 14.696, t_sc: float = 60.0, errors: str = "raise"
    ) -> FloatOrArray: ...
    def bg_rb_per_mscf(
        self, p_psia: ArrayLike, t_f: ArrayLike, *, p_sc: float = 14.696, t_sc: float = 60.0, errors: str = "raise"
    ) -> FloatOrArray: ...
    def eg(
        self, p_psia: ArrayLike, t_f: ArrayLike, *, p_sc: float = 14.696, t_sc: float = 60.0, errors: str = "raise"
    ) -> FloatOrArray: ...
    def density(self, p_psia: ArrayLike, t_f: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def viscosity(self, p_psia: ArrayLike, t_f: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def cg(self, p_psia: ArrayLike, t_f: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
    def pseudo_pressure(self, p_psia: ArrayLike, t_f: float, *, errors: str = "raise") -> FloatOrArray: ...
    def in_range(self, p_psia: ArrayLike, t_f: ArrayLike) -> Dict[str, Union[bool, npt.NDArray[np.bool_]]]: ...
    def __eq__(self, other: object, /) -> bool: ...
    def __reduce__(self) -> Tuple[Any, Tuple[Any, Dict[str, Any]], None]: ...


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
    def co(self, p: ArrayLike, *, gas: _Optional[Gas] = None, errors: str = "raise") -> FloatOrArray: ...
    def table(
        self, p: _Sequence[float], *, gas: _Optional[Gas] = None, water: _Optional[Water] = None
    ) -> Dict[str, npt.NDArray[Any]]: ...
    def check_table(
        self, p: _Sequence[float], *, gas: _Optional[Gas] = None, water: _Optional[Water] = None
    ) -> _List[Tuple[float, str, str]]: ...
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
    gas: _Optional[Union[Gas, _Sequence[Gas]]] = None,
    water: _Optional[Union[Water, _Sequence[Water]]] = None,
    errors: str = "raise",
) -> Dict[str, Any]: ...
def table_columns() -> _List[Tuple[str, str]]: ...


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
    def check(self) -> List[Tuple[float, str, str]]: ...
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
def gas_history_match(
    *,
    t_days: ArrayLike,
    p: ArrayLike,
    gp_scf: ArrayLike,
    p_initial: float,
    table_p: ArrayLike,
    table_z: Optional[ArrayLike] = None,
    table_bg: Optional[ArrayLike] = None,
    temperature_f: Optional[float] = None,
    wp_stb: Optional[ArrayLike] = None,
    bw: float = 1.0,
    swi: float = 0.0,
    cw: float = 0.0,
    cf: float = 0.0,
    aquifer: Optional[Aquifer] = None,
    fit_shape: bool = True,
    fit_red: bool = False,
    fit_ce: bool = False,
    objective: str = "pressure",
    max_iterations: int = 100,
    tolerance: float = 1e-10,
    confidence: float = 0.95,
    p_sc: float = 14.696,
    t_sc: float = 60.0,
) -> Dict[str, Any]: ...
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
def tarner_forecast(
    pvt: PvtTable,
    relperm: CoreyGasOil,
    *,
    p_bubble: float,
    p_end: float,
    n_steps: int = 100,
) -> Dict[str, Any]: ...


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

def ooip(area: ArrayLike, thickness: ArrayLike, net_to_gross: ArrayLike, porosity: ArrayLike, sw: ArrayLike, boi: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def ogip(area: ArrayLike, thickness: ArrayLike, net_to_gross: ArrayLike, porosity: ArrayLike, sw: ArrayLike, bgi: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def ooip_from_rock_volume(gross_rock_volume: ArrayLike, net_to_gross: ArrayLike, porosity: ArrayLike, sw: ArrayLike, boi: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def ogip_from_rock_volume(gross_rock_volume: ArrayLike, net_to_gross: ArrayLike, porosity: ArrayLike, sw: ArrayLike, bgi: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def dissolved_gas_in_place(ooip: ArrayLike, rsi: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def gas_cap_ratio(gas_cap_gas: ArrayLike, bgi: ArrayLike, ooip: ArrayLike, boi: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def recoverable(in_place: ArrayLike, recovery_factor: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def recovery_factor(recoverable: ArrayLike, in_place: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def remaining_recoverable(in_place: ArrayLike, recovery_factor: ArrayLike, cumulative: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def arps_solution_gas_drive(porosity: ArrayLike, sw: ArrayLike, bob: ArrayLike, k_md: ArrayLike, mu_ob: ArrayLike, pb: ArrayLike, pa: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def arps_water_drive(porosity: ArrayLike, sw: ArrayLike, boi: ArrayLike, k_md: ArrayLike, mu_wi: ArrayLike, mu_oi: ArrayLike, pi: ArrayLike, pa: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def _arps_solution_gas_validity(porosity: ArrayLike, sw: ArrayLike, k_md: ArrayLike, mu_ob: ArrayLike, pb: ArrayLike, pa: ArrayLike) -> FloatOrArray: ...
def _arps_water_drive_validity(porosity: ArrayLike, sw: ArrayLike, k_md: ArrayLike, mu_wi: ArrayLike, mu_oi: ArrayLike, pi: ArrayLike, pa: ArrayLike) -> FloatOrArray: ...
def gas_recovery_factor_pz(pi: ArrayLike, zi: ArrayLike, pa: ArrayLike, za: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def gravity_number(k_md: ArrayLike, area_ft2: ArrayLike, delta_sg: ArrayLike, dip_deg: ArrayLike, qt_rb_per_day: ArrayLike, *, errors: str = "raise") -> FloatOrArray: ...
def fractional_flow(relperm: CoreyOilWater, sw: ArrayLike, *, mu_o: float, mu_w: float, gravity: float = 0.0) -> FloatOrArray: ...
def welge_front(relperm: CoreyOilWater, *, mu_o: float, mu_w: float, swi: Union[float, None] = None, gravity: float = 0.0) -> Dict[str, float]: ...
def waterflood_displacement(relperm: CoreyOilWater, pv_injected: ArrayLike, *, mu_o: float, mu_w: float, swi: Union[float, None] = None, gravity: float = 0.0, errors: str = "raise") -> Tuple[FloatOrArray, FloatOrArray, FloatOrArray, FloatOrArray]: ...
@final
class Distribution:
    def __new__(
        cls,
        kind: str,
        *,
        value: Union[float, None] = None,
        low: Union[float, None] = None,
        mode: Union[float, None] = None,
        high: Union[float, None] = None,
        mean: Union[float, None] = None,
        sd: Union[float, None] = None,
        mu: Union[float, None] = None,
        sigma: Union[float, None] = None,
        p90: Union[float, None] = None,
        p10: Union[float, None] = None,
    ) -> Distribution: ...
    @staticmethod
    def fixed(value: float) -> Distribution: ...
    @staticmethod
    def uniform(low: float, high: float) -> Distribution: ...
    @staticmethod
    def triangular(low: float, mode: float, high: float) -> Distribution: ...
    @staticmethod
    def pert(low: float, mode: float, high: float) -> Distribution: ...
    @staticmethod
    def normal(mean: Union[float, None] = None, sd: Union[float, None] = None, *, p90: Union[float, None] = None, p10: Union[float, None] = None, low: Union[float, None] = None, high: Union[float, None] = None) -> Distribution: ...
    @staticmethod
    def lognormal(mean: Union[float, None] = None, sd: Union[float, None] = None, *, mu: Union[float, None] = None, sigma: Union[float, None] = None, p90: Union[float, None] = None, p10: Union[float, None] = None, low: Union[float, None] = None, high: Union[float, None] = None) -> Distribution: ...
    @property
    def kind(self) -> str: ...
    def mean(self) -> float: ...
    def variance(self) -> float: ...
    def support(self) -> Tuple[float, float]: ...
    def sample(self, n: int, *, seed: int = 0, stream: int = 0) -> npt.NDArray[np.float64]: ...
    def params(self) -> Dict[str, float]: ...
    def __reduce__(self) -> Tuple[Any, Tuple[Any, Dict[str, Any]], None]: ...

def probabilistic_in_place(
    fluid: str = "oil",
    *,
    area: Union[Distribution, float],
    thickness: Union[Distribution, float],
    porosity: Union[Distribution, float],
    sw: Union[Distribution, float],
    fvf: Union[Distribution, float],
    net_to_gross: Union[Distribution, float, None] = None,
    recovery_factor: Union[Distribution, float, None] = None,
    correlation: Union[Dict[Tuple[str, str], float], None] = None,
    trials: int = 100000,
    seed: int = 0,
) -> Dict[str, Any]: ...
def summarize(samples: ArrayLike) -> Dict[str, float]: ...

# ---- units ---------------------------------------------------------------------------------

ALL_UNITS: str

def convert_units(value: ArrayLike, from_unit: str, to_unit: str) -> FloatOrArray: ...
def unit_factor(from_unit: str, to_unit: str) -> Tuple[float, float]: ...
def unit_quantity(unit: str) -> str: ...
def rebase_gas_volume(volume: ArrayLike, *, from_p_sc: float, from_t_sc: float, to_p_sc: float, to_t_sc: float) -> FloatOrArray: ...

# ---- end -----------------------------------------------------------------------------------
