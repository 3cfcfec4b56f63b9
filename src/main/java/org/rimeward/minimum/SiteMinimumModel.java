package org.rimeward.minimum;

import java.time.LocalDate;
import java.util.Objects;
import org.apache.commons.math3.distribution.TDistribution;

/**
 * A site's own minimum-temperature model, FAO 2005 ch. 6 (Snyder &amp; de Melo-Abreu, after Allen
 * 1957): {@code Tmin = a·T0 + b·Td0 + c}, with {@code T0} and {@code Td0} the air temperature and
 * dew point two hours after sunset on a radiation night, fitted by least squares to the site's
 * history. Valid on radiation nights (clear, calm) only, and within the range it was fitted on.
 *
 * @param a coefficient of the air temperature at sunset + 2 h
 * @param b coefficient of the dew point at sunset + 2 h
 * @param c constant, °C
 * @param nights radiation nights the fit used
 * @param residualSdC standard deviation of the residuals (n − 3 degrees of freedom), °C
 * @param rSquared coefficient of determination
 * @param xtxInv (XᵀX)⁻¹ of the design matrix, rows and columns in the order 1, T0, Td0: what the
 *     prediction interval needs
 * @param from the first night's date
 * @param to the last night's date
 * @param historySha256 SHA-256 of the history file's bytes
 * @param historyName the history file's name
 * @param station the station the history is of (empty: the file names none)
 * @param criteria the radiation-night criteria, in words
 * @param rangeT0C lowest and highest T0 fitted on, °C
 * @param rangeTd0C lowest and highest Td0 fitted on, °C
 */
public record SiteMinimumModel(double a, double b, double c, int nights, double residualSdC,
    double rSquared, double[][] xtxInv, LocalDate from, LocalDate to, String historySha256,
    String historyName, String station, String criteria, double[] rangeT0C, double[] rangeTd0C) {
  /** Confidence of the prediction interval. */
  public static final double INTERVAL_LEVEL = 0.95;

  public SiteMinimumModel {
    Objects.requireNonNull(from, "from");
    Objects.requireNonNull(to, "to");
    Objects.requireNonNull(historySha256, "historySha256");
    Objects.requireNonNull(station, "station");
    if (!(Double.isFinite(a) && Double.isFinite(b) && Double.isFinite(c))) {
      throw new IllegalArgumentException("coefficients must be finite: a=" + a + " b=" + b + " c=" + c);
    }
    if (nights < 4) {
      throw new IllegalArgumentException("nights must be at least 4, was " + nights);
    }
    if (!(residualSdC >= 0) || !Double.isFinite(residualSdC)) {
      throw new IllegalArgumentException("residual SD must be finite and ≥ 0, was " + residualSdC);
    }
    if (xtxInv.length != 3 || xtxInv[0].length != 3 || xtxInv[1].length != 3 || xtxInv[2].length != 3) {
      throw new IllegalArgumentException("xtx_inv must be 3 × 3");
    }
    xtxInv = new double[][] {xtxInv[0].clone(), xtxInv[1].clone(), xtxInv[2].clone()};
    rangeT0C = rangeT0C.clone();
    rangeTd0C = rangeTd0C.clone();
  }

  /** The predicted minimum, °C. */
  public double minAirC(double t0C, double td0C) {
    return a * t0C + b * td0C + c;
  }

  /**
   * Half-width of the 95 % prediction interval of a single night's minimum:
   * {@code t(0.975, n−3) · s · √(1 + x₀ᵀ(XᵀX)⁻¹x₀)} with {@code x₀ = (1, T0, Td0)} (the ordinary
   * least-squares prediction interval; any regression text, e.g. Montgomery, Peck &amp; Vining,
   * <i>Introduction to Linear Regression Analysis</i>, §3.5).
   */
  public double halfWidthC(double t0C, double td0C) {
    double[] x = {1, t0C, td0C};
    double q = 0;
    for (int i = 0; i < 3; i++) {
      for (int j = 0; j < 3; j++) {
        q += x[i] * xtxInv[i][j] * x[j];
      }
    }
    double t = new TDistribution(nights - 3).inverseCumulativeProbability(0.5 + INTERVAL_LEVEL / 2);
    return t * residualSdC * Math.sqrt(1 + q);
  }

  /** Whether (T0, Td0) lies inside the ranges the model was fitted on. */
  public boolean withinFit(double t0C, double td0C) {
    return t0C >= rangeT0C[0] && t0C <= rangeT0C[1] && td0C >= rangeTd0C[0] && td0C <= rangeTd0C[1];
  }

  @Override
  public double[][] xtxInv() {
    return new double[][] {xtxInv[0].clone(), xtxInv[1].clone(), xtxInv[2].clone()};
  }

  @Override
  public double[] rangeT0C() {
    return rangeT0C.clone();
  }

  @Override
  public double[] rangeTd0C() {
    return rangeTd0C.clone();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof SiteMinimumModel m && a == m.a && b == m.b && c == m.c && nights == m.nights
        && historySha256.equals(m.historySha256) && from.equals(m.from) && to.equals(m.to);
  }

  @Override
  public int hashCode() {
    return Objects.hash(a, b, c, nights, historySha256, from, to);
  }
}
