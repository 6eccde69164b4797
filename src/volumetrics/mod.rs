//! Volumetric oil and gas in place, Monte Carlo uncertainty, recovery factors and
//! displacement efficiency. Field units.
