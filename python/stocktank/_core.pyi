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


# ---- water ---------------------------------------------------------------------------------


# ---- material_balance ----------------------------------------------------------------------


# ---- decline -------------------------------------------------------------------------------


# ---- volumetrics ---------------------------------------------------------------------------


# ---- units ---------------------------------------------------------------------------------


# ---- end -----------------------------------------------------------------------------------
