//! Natural-gas properties: pseudo-critical properties, Z-factor, Bg, density, compressibility,
//! viscosity and real-gas pseudo-pressure. Field units.
