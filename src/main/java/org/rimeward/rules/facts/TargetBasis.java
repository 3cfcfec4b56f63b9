package org.rimeward.rules.facts;

/** What the farm protects to: each stage's 10 % kill temperature, or one fixed temperature. */
public enum TargetBasis {
  T10,
  FIXED
}
