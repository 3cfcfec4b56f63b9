package org.rimeward.minimum;

import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.linear.SingularMatrixException;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.rimeward.io.BadInputException;

/**
 * Fits the FAO 2005 ch. 6 site-minimum regression {@code Tmin = a·T0 + b·Td0 + c} to a history's
 * radiation nights by ordinary least squares (Apache Commons Math, QR decomposition).
 */
public final class SiteMinimumFit {
  /**
   * Fewest radiation nights a fit accepts: three coefficients need far more nights than three for
   * the residual SD to mean anything; ten leave seven degrees of freedom. A Rimeward choice.
   */
  public static final int MIN_NIGHTS = 10;

  private SiteMinimumFit() {}

  /** The least-squares coefficients and statistics, before provenance is attached. */
  public record Result(double a, double b, double c, int nights, double residualSdC,
      double rSquared, double[][] xtxInv, double[] rangeT0C, double[] rangeTd0C) {}

  /**
   * Fits the used nights of {@code samples}; refuses with the reason ({@link BadInputException})
   * when fewer than {@code minNights} qualify or the nights cannot separate T0 from Td0.
   */
  public static Result fit(List<NightSample> samples, int minNights, String historyName) {
    List<NightSample> used = samples.stream().filter(NightSample::used).toList();
    if (used.size() < minNights) {
      long windy = samples.stream().filter(s -> s.excluded().orElse("").startsWith("windy")).count();
      long cloudy = samples.stream().filter(s -> s.excluded().orElse("").startsWith("cloudy")).count();
      throw new BadInputException(String.format(Locale.ROOT, "%s: only %d radiation night(s) qualify"
          + " out of %d nights (%d windy, %d cloudy, %d other); the site-minimum fit needs at least"
          + " %d; give a longer history of clear calm nights", historyName, used.size(),
          samples.size(), windy, cloudy, samples.size() - used.size() - windy - cloudy, minNights));
    }
    double[] y = new double[used.size()];
    double[][] x = new double[used.size()][];
    double[] t0 = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
    double[] td0 = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
    for (int i = 0; i < used.size(); i++) {
      NightSample s = used.get(i);
      y[i] = s.minAirC();
      x[i] = new double[] {s.airC(), s.dewC()};
      t0[0] = Math.min(t0[0], s.airC());
      t0[1] = Math.max(t0[1], s.airC());
      td0[0] = Math.min(td0[0], s.dewC());
      td0[1] = Math.max(td0[1], s.dewC());
    }
    OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
    ols.newSampleData(y, x);
    try {
      double[] beta = ols.estimateRegressionParameters();
      double[][] v = ols.estimateRegressionParametersVariance();
      double sd = ols.estimateRegressionStandardError();
      double r2 = ols.calculateRSquared();
      return new Result(beta[1], beta[2], beta[0], used.size(), sd, r2, v, t0, td0);
    } catch (SingularMatrixException e) {
      throw new BadInputException(historyName + ": the " + used.size() + " radiation nights cannot"
          + " separate the air temperature from the dew point (they move together exactly); give a"
          + " history with more varied nights", e);
    }
  }
}
