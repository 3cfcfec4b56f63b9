package org.rimeward.plan;

import java.util.List;

/** The cautions every plan carries, whatever it recommends. */
public final class StandingCautions {
  public static final List<String> ALL = List.of(
      "Decision support only: the grower makes the decision and is responsible for it.",
      "Check thermometers at bud height in each block: these temperatures are estimates from a"
          + " forecast for one point, and a block can run colder.",
      "Follow local codes, water rights and licensed practice for pumping, sprinkling and any"
          + " other frost-protection method.",
      "Critical temperatures are published averages for 30 minutes at bud tissue temperature;"
          + " real buds vary with variety, vigour and the weather of the days before.");

  /** The same cautions folded into one line, for a plan a manager reads at a glance. */
  public static final String ONE_LINE = "Always: decision support only, the grower decides; check"
      + " thermometers at bud height in each block (these are forecast estimates); follow local codes,"
      + " water rights and licensed practice; critical temperatures are published averages.";

  private StandingCautions() {}
}
