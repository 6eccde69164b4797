"""Write notebooks-demo/03_water.ipynb (formation water properties) with nbformat.

Usage: python scripts/make_notebook_03_water.py
"""

import pathlib

import nbformat
from nbformat.v4 import new_code_cell, new_markdown_cell, new_notebook

CELLS = [
    new_markdown_cell(
        """# Formation water (brine) properties

The Harrow Flats field is an invented example: its Lower Tern sand holds oil over an aquifer
at **214 degF** and an initial pressure of **4,350 psia**. A produced-water sample from the
invented well HF-07 reports **68,000 mg/L** total dissolved solids.

This notebook builds the `Water` description for that brine and plots its formation volume
factor, viscosity, density, gas solubility and compressibility against pressure, temperature and
salinity. Field units: psia, degF, rb/STB, cp, lbm/ft3, scf/STB, 1/psi.

*These are screening estimates from published correlations (McCain 1990/1991, Osif 1988,
Meehan 1980); defer to measured water analyses and laboratory PVT data.*"""
    ),
    new_code_cell(
        """import matplotlib.pyplot as plt
import numpy as np

import stocktank as stk"""
    ),
    new_markdown_cell(
        """## The brine

Laboratories often report salinity per litre; the correlations want weight percent of the brine.
`salinity_mg_per_l_to_wt_pct` converts with the brine density at 60 degF (mass ppm would simply be
divided by 10,000)."""
    ),
    new_code_cell(
        """s = stk.salinity_mg_per_l_to_wt_pct(68_000.0)
brine = stk.Water(salinity_wt_pct=round(s, 3))
p_res, t_res = 4350.0, 214.0
print(brine)
print(f"salinity            {brine.salinity_wt_pct:.3f} wt%")
print(f"Bw                  {brine.bw(p_res, t_res):.4f} rb/STB")
print(f"density             {brine.density(p_res, t_res):.2f} lbm/ft3")
print(f"viscosity           {brine.viscosity(p_res, t_res):.3f} cp")
print(f"Rsw                 {brine.rsw(p_res, t_res):.1f} scf/STB")
print(f"compressibility     {brine.compressibility(p_res, t_res):.3e} 1/psi")
print(f"inside all published ranges: {brine.in_range(p_res, t_res)}")"""
    ),
    new_markdown_cell(
        """All properties on a small grid, as a table with the units in the column names
(`water_table` needs pandas):"""
    ),
    new_code_cell(
        """stk.water_table(brine, [[2000.0], [p_res], [6000.0]], [180.0, t_res]).round(6)"""
    ),
    new_markdown_cell(
        """## Bw and density against pressure

Every method broadcasts like numpy: a column of temperatures against a row of pressures gives a
table in one call."""
    ),
    new_code_cell(
        """p = np.linspace(500.0, 8000.0, 80)
temps = np.array([[120.0], [170.0], [214.0], [260.0]])
bw = brine.bw(p, temps)
rho = brine.density(p, temps)
fig, ax = plt.subplots(1, 2, figsize=(11, 4))
for k, t in enumerate(temps[:, 0]):
    ax[0].plot(p, bw[k], label=f"{t:.0f} degF")
    ax[1].plot(p, rho[k], label=f"{t:.0f} degF")
ax[0].set(xlabel="pressure, psia", ylabel="Bw, rb/STB", title="Formation volume factor (McCain 1990)")
ax[1].set(xlabel="pressure, psia", ylabel="density, lbm/ft3", title="Brine density")
ax[0].axvline(p_res, color="grey", ls=":")
ax[1].axvline(p_res, color="grey", ls=":")
ax[0].legend()
fig.tight_layout()"""
    ),
    new_markdown_cell(
        """## Viscosity against temperature and salinity

Salt raises the viscosity; heat lowers it strongly."""
    ),
    new_code_cell(
        """t = np.linspace(80.0, 350.0, 100)
salinities = np.array([[0.0], [5.0], [brine.salinity_wt_pct], [15.0], [25.0]])
mu = stk.water_viscosity(p_res, t, salinities)
fig, ax = plt.subplots(figsize=(6, 4))
for k, s_k in enumerate(salinities[:, 0]):
    ax.plot(t, mu[k], label=f"{s_k:.1f} wt%")
ax.axvline(t_res, color="grey", ls=":")
ax.set(xlabel="temperature, degF", ylabel="viscosity, cp", title=f"Brine viscosity at {p_res:.0f} psia (Meehan 1980)")
ax.legend()
fig.tight_layout()"""
    ),
    new_markdown_cell(
        """## Viscosity against pressure: the two correlations and IAPWS

For pure water the reference is the IAPWS formulation as computed by CoolProp. McCain's (1991)
published pressure factor makes viscosity climb far faster with pressure than pure water does, which
is why `Water` defaults to Meehan (1980). Both methods are available (`viscosity_method=`)."""
    ),
    new_code_cell(
        """import CoolProp.CoolProp as CP

PA_PER_PSI = 6894.757293168
p = np.linspace(1000.0, 10000.0, 40)
t_k = (t_res - 32.0) / 1.8 + 273.15
mu_iapws = np.array([CP.PropsSI("V", "T", t_k, "P", x * PA_PER_PSI, "Water") * 1000.0 for x in p])
fig, ax = plt.subplots(figsize=(6, 4))
ax.plot(p, mu_iapws, "k-", lw=2, label="IAPWS (CoolProp), pure water")
ax.plot(p, stk.water_viscosity(p, t_res, 0.0, method="meehan"), label="Meehan (1980)")
ax.plot(p, stk.water_viscosity(p, t_res, 0.0, method="mccain"), label="McCain (1991)")
ax.set(xlabel="pressure, psia", ylabel="viscosity, cp", title=f"Pure water at {t_res:.0f} degF")
ax.legend()
fig.tight_layout()"""
    ),
    new_markdown_cell(
        """## Gas solubility and compressibility

Gas-saturated water holds more gas at higher pressure and less when salty (McCain 1991). Its
compressibility with no free gas (Osif 1988 with the Dodson–Standing factor) is a few 1e-6 1/psi;
below the saturation pressure the gas that comes out of solution raises the apparent
compressibility several-fold (McCain 1991). For that curve we assume an invented gas FVF
Bg = 0.00504 z T / p rb/scf with z = 0.9."""
    ),
    new_code_cell(
        """p = np.linspace(1000.0, 8000.0, 60)
fresh_gas_free = stk.Water(salinity_wt_pct=brine.salinity_wt_pct, gas_saturated=False)
bg = 0.00504 * 0.9 * (t_res + 459.67) / p
fig, ax = plt.subplots(1, 2, figsize=(11, 4))
for s_k in [0.0, brine.salinity_wt_pct, 20.0]:
    ax[0].plot(p, stk.water_rsw(p, t_res, s_k), label=f"{s_k:.1f} wt%")
ax[0].set(xlabel="pressure, psia", ylabel="Rsw, scf/STB", title=f"Gas solubility at {t_res:.0f} degF")
ax[0].legend()
ax[1].semilogy(p, fresh_gas_free.compressibility(p, t_res), label="gas-free (Osif 1988)")
ax[1].semilogy(p, brine.compressibility(p, t_res), label="gas-saturated, no free gas")
ax[1].semilogy(p, brine.compressibility_with_gas_release(p, t_res, bg), label="with gas release")
ax[1].set(xlabel="pressure, psia", ylabel="cw, 1/psi", title="Water compressibility")
ax[1].legend()
fig.tight_layout()"""
    ),
    new_markdown_cell(
        """## Where the correlations were fitted

The `*_in_range` functions return True where the inputs lie inside a correlation's published
range; outside it the value is still computed. Here the map of (p, T) where every correlation used by
this brine is inside its range."""
    ),
    new_code_cell(
        """pp, tt = np.meshgrid(np.linspace(500.0, 10000.0, 120), np.linspace(80.0, 350.0, 120))
ok = brine.in_range(pp, tt)
fig, ax = plt.subplots(figsize=(6, 4))
ax.contourf(pp, tt, ok.astype(float), levels=[-0.5, 0.5, 1.5], colors=["#f2d0d0", "#cfe8cf"])
ax.plot(p_res, t_res, "k*", ms=12, label="Lower Tern sand")
ax.set(xlabel="pressure, psia", ylabel="temperature, degF", title="Inside all published ranges (green)")
ax.legend()
fig.tight_layout()"""
    ),
]


def main() -> None:
    nb = new_notebook(cells=CELLS)
    nb.metadata["kernelspec"] = {"name": "python3", "display_name": "Python 3", "language": "python"}
    out = pathlib.Path(__file__).resolve().parent.parent / "notebooks-demo" / "03_water.ipynb"
    out.parent.mkdir(exist_ok=True)
    nbformat.write(nb, out)
    print(f"wrote {out}")


if __name__ == "__main__":
    main()
