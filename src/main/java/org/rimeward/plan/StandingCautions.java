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

  private StandingCautions() {}
}
