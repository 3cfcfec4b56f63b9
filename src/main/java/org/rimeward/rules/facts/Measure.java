package org.rimeward.rules.facts;

/** The quantities of a block's night series that rules can ask about. */
public enum Measure {
  /** Air temperature at the block (forecast plus the block's cold-air offset), °C. */
  AIR_C,
  /** Dew point at the block (never above its air), °C. */
  DEW_POINT_C,
  /** Temperature of a dry bud: air less the radiative depression, °C. */
  DRY_BUD_C,
  /** Temperature a bud falls to once wetted: wet-bulb less the radiative depression, °C. */
  WET_BUD_C,
  /** Wet-bulb temperature at the block and the site's pressure, °C. */
  WET_BULB_C,
  /** Wind at 10 m, the height forecasts report and extension limits are stated at, m/s. */
  WIND_10M_MS,
  /** Wind at 2 m, m/s. */
  WIND_2M_MS,
  /**
   * Over-plant application rate that keeps an iced bud at 0 °C, mm/h; NaN at a step where the
   * water balance cannot compute it (outside its stated range). Rules ask for known values and
   * for the first unknown one; a NaN never leaves the series.
   */
  REQUIRED_RATE_MM_H,
  /** Cloud cover, %. */
  CLOUD_PCT,
  /** Global solar radiation, W/m²; 0 where the forecast gives none. */
  SOLAR_WM2
}
