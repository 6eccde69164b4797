//! Production decline (Arps) models, robust fitting of one or many wells, forecasts and
//! EUR. Rates per day, time in days or months as documented.
