//! Material balance of oil and gas reservoirs, aquifer influx models, drive indices and
//! the solution-gas-drive forecast. Field units.
