package org.rimeward.rules.facts;

/**
 * Derived: how far above the target the wet-bud temperature may fall before sprinkling starts
 * tonight, and whether the farm set it or the rules' default applies.
 */
public record StartMargin(double marginC, boolean fromFarm) {}
