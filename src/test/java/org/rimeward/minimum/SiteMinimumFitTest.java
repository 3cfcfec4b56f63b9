package org.rimeward.minimum;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;
import org.rimeward.plan.RadiationNightCriteria;
import org.rimeward.rules.RuleBook;
import org.rimeward.rules.RuleThresholds;
import org.rimeward.weather.Readings;
import org.rimeward.weather.ReadingsReader;

/**
 * The site-minimum fit, FAO 2005 (Snyder &amp; de Melo-Abreu, Frost Protection: fundamentals,
 * practice and economics, vol. 1, ch. 6, after Allen 1957): Tmin = a·T0 + b·Td0 + c from readings
 * two hours after sunset on radiation nights. Sources and values: docs/reference/site-minimum.md.
 * The generated histories are invented data, made to obey a known law.
 */
class SiteMinimumFitTest {
  @TempDir Path tmp;

  // FAO 2005 book data as transcribed in the R 'frost' package (buildFAO/predFAO examples,
  // "data example taken from FAO Book"; SEEN-2nd): ten radiation nights.
  private static final double[] BOOK_T0 = {3.2, 0.8, 0.2, 2.6, 4.4, 5.2, 2.7, 1.2, 4.5, 5.6};
  private static final double[] BOOK_TD0 = {-4.2, -8.8, -6.5, -6.2, -6.1, 2.6, -0.7, -1.7, -1.2, 0.1};
  private static final double[] BOOK_TMIN = {-3.1, -5, -6.3, -5.4, -4, -2.5, -4.8, -5, -4.4, -3.3};

  private static List<NightSample> book() {
    List<NightSample> s = new ArrayList<>();
    for (int i = 0; i < BOOK_T0.length; i++) {
      s.add(new NightSample(LocalDate.of(2005, 1, 1).plusDays(i), Instant.EPOCH, BOOK_T0[i],
          BOOK_TD0[i], BOOK_TMIN[i], Double.NaN, Double.NaN, Double.NaN, Optional.empty()));
    }
    return s;
  }

  @Test
  void bookExampleJointLeastSquaresMatchesAnIndependentSolver() {
    SiteMinimumFit.Result r = SiteMinimumFit.fit(book(), 10, "book");
    // COMPUTED with NumPy's lstsq on the same ten nights (a general-purpose reference solver).
    assertThat(r.a()).isCloseTo(0.447298, within(1e-5));
    assertThat(r.b()).isCloseTo(0.045073, within(1e-5));
    assertThat(r.c()).isCloseTo(-5.592397, within(1e-5));
    assertThat(r.residualSdC()).isCloseTo(0.748750, within(1e-5));
    assertThat(r.rSquared()).isCloseTo(0.677165, within(1e-5));
    assertThat(r.nights()).isEqualTo(10);
  }

  @Test
  void bookExampleTwoStepFitOfTheSpreadsheetIsReproducedAndTheJointFitIsNoWorse() {
    // The R 'frost' package fits as FAO's FFST.xls does, in two steps (Tmin on T0, then the
    // residuals on Td0), and prints -0.7409219 °C for T0 = 10, Td0 = 2. Reproducing it checks the
    // transcription of the data; the joint fit then must leave no more squared error.
    SimpleRegression first = new SimpleRegression();
    for (int i = 0; i < 10; i++) {
      first.addData(BOOK_T0[i], BOOK_TMIN[i]);
    }
    SimpleRegression second = new SimpleRegression();
    for (int i = 0; i < 10; i++) {
      second.addData(BOOK_TD0[i], BOOK_TMIN[i] - first.predict(BOOK_T0[i]));
    }
    double a2 = first.getSlope();
    double b2 = second.getSlope();
    double c2 = first.getIntercept() + second.getIntercept();
    assertThat(a2 * 10 + b2 * 2 + c2).isCloseTo(-0.7409219, within(1e-6));
    SiteMinimumFit.Result r = SiteMinimumFit.fit(book(), 10, "book");
    double sseJoint = 0;
    double sseTwoStep = 0;
    for (int i = 0; i < 10; i++) {
      sseJoint += Math.pow(BOOK_TMIN[i] - (r.a() * BOOK_T0[i] + r.b() * BOOK_TD0[i] + r.c()), 2);
      sseTwoStep += Math.pow(BOOK_TMIN[i] - (a2 * BOOK_T0[i] + b2 * BOOK_TD0[i] + c2), 2);
    }
    assertThat(sseJoint).isLessThanOrEqualTo(sseTwoStep);
    assertThat(sseJoint).isCloseTo(3.924383, within(1e-5));
  }

  @Test
  void predictionIntervalIsTheOrdinaryLeastSquaresOne() {
    SiteMinimumFit.Result r = SiteMinimumFit.fit(book(), 10, "book");
    SiteMinimumModel m = model(r);
    // COMPUTED with NumPy/SciPy: t(0.975, 7) · s · √(1 + x0ᵀ(XᵀX)⁻¹x0) at T0 = 3, Td0 = -4.
    assertThat(m.minAirC(3, -4)).isCloseTo(-4.430795, within(1e-5));
    assertThat(m.halfWidthC(3, -4)).isCloseTo(1.862623, within(1e-5));
    assertThat(m.withinFit(3, -4)).isTrue();
    assertThat(m.withinFit(10, 2)).as("T0 10 °C is above every night fitted").isFalse();
  }

  private static SiteMinimumModel model(SiteMinimumFit.Result r) {
    return new SiteMinimumModel(r.a(), r.b(), r.c(), r.nights(), r.residualSdC(), r.rSquared(),
        r.xtxInv(), LocalDate.of(2005, 1, 1), LocalDate.of(2005, 1, 10), "0".repeat(64), "book",
        "", "test", r.rangeT0C(), r.rangeTd0C());
  }

  /**
   * The criteria the bundled rule files set (rule THRESHOLDS: FAO 2005's 2 m/s for radiation
   * frost, Rimeward's stated choices for the rest), as {@code minimum fit} and the re-plan use them.
   */
  private static final RadiationNights.Criteria RULES = RadiationNightCriteria.of(
      RuleThresholds.of(RuleBook.load(Path.of("rules"))));

  private static final double A = 0.7;
  private static final double B = 0.3;
  private static final double C = -4.5;

  private Readings history(HistoryWriter w) throws Exception {
    Path f = tmp.resolve("history-" + System.nanoTime() + ".csv");
    Files.writeString(f, w.text());
    Readings r = ReadingsReader.read(f, HistoryWriter.ZONE);
    assertThat(r.skipped()).isEmpty();
    return r;
  }

  private static List<NightSample> nights(Readings r, RadiationNights.Criteria k) {
    return RadiationNights.nights(r.of(""), HistoryWriter.LAT, HistoryWriter.LON, HistoryWriter.ZONE, k);
  }

  /** Every third night cloudy, every fifth windy: they break the law on purpose. */
  private static HistoryWriter.Kind kindOf(int i) {
    return i % 3 == 1 ? HistoryWriter.Kind.CLOUDY : i % 5 == 2 ? HistoryWriter.Kind.WINDY
        : HistoryWriter.Kind.RADIATION;
  }

  @Test
  void recoversAKnownLawWithCloudyAndWindyNightsLeftOut() throws Exception {
    HistoryWriter w = new HistoryWriter(7, A, B, C, 0, false, true, Duration.ofMinutes(10));
    LocalDate d0 = LocalDate.of(2026, 4, 1);
    int radiation = 0;
    for (int i = 0; i < 45; i++) {
      w.night(d0.plusDays(2L * i), kindOf(i));
      radiation += kindOf(i) == HistoryWriter.Kind.RADIATION ? 1 : 0;
    }
    List<NightSample> all = nights(history(w), RULES);
    SiteMinimumFit.Result r = SiteMinimumFit.fit(all, 10, "history");
    assertThat(r.nights()).isEqualTo(radiation);
    assertThat(all.stream().filter(s -> s.excluded().orElse("").startsWith("cloudy"))).hasSize(15);
    assertThat(all.stream().filter(s -> s.excluded().orElse("").startsWith("windy"))).hasSize(6);
    // Invented law a = 0.7, b = 0.3, c = -4.5 °C; sampling every 10 min costs a few hundredths.
    assertThat(r.a()).isCloseTo(A, within(0.02));
    assertThat(r.b()).isCloseTo(B, within(0.02));
    assertThat(r.c()).isCloseTo(C, within(0.1));
    assertThat(r.residualSdC()).isLessThan(0.05);
    assertThat(r.rSquared()).isGreaterThan(0.99);

    // Near miss: with no night left out the law is not found.
    RadiationNights.Criteria none = new RadiationNights.Criteria(99, 100, -99, -99, Duration.ofMinutes(90));
    SiteMinimumFit.Result polluted = SiteMinimumFit.fit(nights(history(w), none), 10, "history");
    assertThat(Math.abs(polluted.a() - A) + Math.abs(polluted.c() - C)).isGreaterThan(0.5);
  }

  @Test
  void noisyHistoryGivesTheLawWithinItsStandardErrorsAndTheNoiseAsResidualSd() throws Exception {
    HistoryWriter w = new HistoryWriter(11, A, B, C, 0.4, false, true, Duration.ofMinutes(15));
    LocalDate d0 = LocalDate.of(2025, 3, 20);
    for (int i = 0; i < 80; i++) {
      w.night(d0.plusDays(i), HistoryWriter.Kind.RADIATION);
    }
    SiteMinimumFit.Result r = SiteMinimumFit.fit(nights(history(w), RULES),
        10, "history");
    assertThat(r.nights()).isEqualTo(80);
    assertThat(r.residualSdC()).isCloseTo(0.4, within(0.1));
    assertThat(r.a()).isCloseTo(A, within(0.1));
    assertThat(r.b()).isCloseTo(B, within(0.1));
    assertThat(r.c()).isCloseTo(C, within(0.4));
  }

  @Test
  void withoutACloudColumnTheCoolingProxyLeavesOutOvercastAndWindyEvenings() throws Exception {
    HistoryWriter w = new HistoryWriter(5, A, B, C, 0, false, false, Duration.ofMinutes(10));
    LocalDate d0 = LocalDate.of(2026, 4, 1);
    int radiation = 0;
    for (int i = 0; i < 30; i++) {
      w.night(d0.plusDays(i), kindOf(i));
      radiation += kindOf(i) == HistoryWriter.Kind.RADIATION ? 1 : 0;
    }
    RadiationNights.Criteria noWindLimit = new RadiationNights.Criteria(99, 25, 2.0, 1.0,
        Duration.ofMinutes(90));
    List<NightSample> all = nights(history(w), noWindLimit);
    assertThat(all.stream().filter(s -> s.excluded().orElse("").startsWith("not a radiation night")))
        .hasSize(30 - radiation);
    SiteMinimumFit.Result r = SiteMinimumFit.fit(all, 10, "history");
    assertThat(r.a()).isCloseTo(A, within(0.02));
    assertThat(r.c()).isCloseTo(C, within(0.1));
  }

  @Test
  void nightsAcrossBothDaylightSavingChangesAreReadInLocalTimeAndUsed() throws Exception {
    // A logger writing local clock time: spring forward skips 02:00-02:59 on 2026-03-08 and fall
    // back repeats 01:00-01:59 on 2026-11-01 (America/Los_Angeles).
    HistoryWriter w = new HistoryWriter(3, A, B, C, 0, true, true, Duration.ofMinutes(10));
    List<HistoryWriter.Made> made = new ArrayList<>();
    for (LocalDate d = LocalDate.of(2026, 3, 1); d.isBefore(LocalDate.of(2026, 3, 15)); d = d.plusDays(1)) {
      made.add(w.night(d, HistoryWriter.Kind.RADIATION));
    }
    for (LocalDate d = LocalDate.of(2026, 10, 25); d.isBefore(LocalDate.of(2026, 11, 8)); d = d.plusDays(1)) {
      made.add(w.night(d, HistoryWriter.Kind.RADIATION));
    }
    List<NightSample> all = nights(history(w), RULES);
    for (LocalDate dst : List.of(LocalDate.of(2026, 3, 7), LocalDate.of(2026, 10, 31))) {
      NightSample s = all.stream().filter(n -> n.date().equals(dst)).findFirst().orElseThrow();
      HistoryWriter.Made m = made.stream().filter(n -> n.date().equals(dst)).findFirst().orElseThrow();
      assertThat(s.used()).as(dst + " " + s.excluded()).isTrue();
      assertThat(s.airC()).as("T0 on " + dst).isCloseTo(m.t0C(), within(0.02));
      assertThat(s.dewC()).isCloseTo(m.td0C(), within(0.001));
      assertThat(s.minAirC()).as("minimum on " + dst).isCloseTo(m.minC(), within(0.05));
    }
    SiteMinimumFit.Result r = SiteMinimumFit.fit(all, 10, "history");
    assertThat(r.nights()).isEqualTo(28);
    assertThat(r.a()).isCloseTo(A, within(0.02));
  }

  @Test
  void tooFewRadiationNightsAreRefusedWithTheReason() throws Exception {
    HistoryWriter w = new HistoryWriter(9, A, B, C, 0, false, true, Duration.ofMinutes(10));
    LocalDate d0 = LocalDate.of(2026, 4, 1);
    for (int i = 0; i < 16; i++) {
      w.night(d0.plusDays(i), i < 6 ? HistoryWriter.Kind.RADIATION : HistoryWriter.Kind.CLOUDY);
    }
    List<NightSample> all = nights(history(w), RULES);
    assertThatThrownBy(() -> SiteMinimumFit.fit(all, 10, "history.csv"))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("history.csv: only 6 radiation night(s) qualify out of 16")
        .hasMessageContaining("10 cloudy").hasMessageContaining("at least 10");
    assertThat(SiteMinimumFit.fit(all, 6, "history.csv").nights()).as("near miss: 6 of 6").isEqualTo(6);
  }

  @Test
  void windExactlyAtTheLimitCountsAsCalmAndJustAboveDoesNot() {
    RadiationNights.Criteria at = new RadiationNights.Criteria(1.0, 25, 2, 1, Duration.ofMinutes(90));
    RadiationNights.Criteria below = new RadiationNights.Criteria(0.99, 25, 2, 1, Duration.ofMinutes(90));
    HistoryWriter w = new HistoryWriter(1, A, B, C, 0, false, true, Duration.ofMinutes(10));
    w.night(LocalDate.of(2026, 4, 10), HistoryWriter.Kind.RADIATION);
    Path f = tmp.resolve("one.csv");
    try {
      Files.writeString(f, w.text());
    } catch (java.io.IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
    Readings r = ReadingsReader.read(f, HistoryWriter.ZONE);
    assertThat(nights(r, at)).singleElement().satisfies(s -> assertThat(s.used()).isTrue());
    assertThat(nights(r, below)).singleElement()
        .satisfies(s -> assertThat(s.excluded()).get().asString().startsWith("windy"));
  }
}
