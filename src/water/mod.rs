//! Formation water (brine) properties: Bw, gas solubility, compressibility, viscosity and
//! density with salinity. Field units.
