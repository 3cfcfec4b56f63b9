package org.rimeward.water;

/**
 * How far sharing may go below a block's installed rate and how small a part is worth protecting.
 * The values are decided in the rule files; this only carries them.
 *
 * @param rateMarginPct a block running below its installed rate keeps at least its need plus
 *     this share of it
 * @param minPartPct the smallest share of a block's area worth sprinkling on its own, when the
 *     block declares no irrigation sets
 */
public record Terms(double rateMarginPct, double minPartPct) {
  public Terms {
    if (!(rateMarginPct >= 0 && rateMarginPct <= 100)) {
      throw new IllegalArgumentException("rate margin must be 0 to 100 %, was " + rateMarginPct);
    }
    if (!(minPartPct > 0 && minPartPct <= 100)) {
      throw new IllegalArgumentException("smallest part must be above 0 and at most 100 %, was " + minPartPct);
    }
  }
}
