//! Oil properties (black-oil correlations): API gravity, bubble point, solution GOR, Bo,
//! compressibility, density, viscosity; calibration; black-oil tables. Field units.
