package org.rimeward.audit;

/** What a recorded input file was to the run that read it. */
public enum InputKind {
  FARM,
  FORECAST,
  CROP_PROFILE,
  RULE,
  READINGS
}
