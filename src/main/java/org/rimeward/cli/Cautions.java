package org.rimeward.cli;

/** The cautions shown in every command's help. The plan repeats its own on every plan. */
final class Cautions {
  static final String HELP_FOOTER =
      "Decision support only: the grower decides. Check thermometers at bud height in each block,"
      + " and follow local codes, water rights and licensed practice.";

  private Cautions() {}
}
