package org.rimeward.physics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The sprinkler balance against the published over-plant rate tables, cell by cell. The tables and
 * their provenance are copied in {@code docs/reference/sprinkling-rates.md}.
 *
 * <p>How a cell is read: the table's temperature is the night's minimum air temperature; its wind
 * band is taken at its middle (0–1 mph as 0.5, 2–4 as 3, 5–8 as 6.5, 10–14 as 12, 18–22 as 20 mph)
 * as the reported wind at 10 m, which is the wind a grower reads off a forecast; the tables give no
 * dew point, so a dry frost night 3 °C below the air is assumed; water at 5 °C; sea level.
 *
 * <p>What the comparison shows: the tables' rates rise with wind about linearly and, at low
 * temperatures, steeper than an energy balance does; a cylinder's convection rises as √u. The
 * model meets the tables in the band that matters for bloom (18–26 °F, calm to 8 mph) to within
 * the tolerances below, asks more than the tables at 27 °F in a breeze (the tables hold their
 * 0.10 in/h practical minimum there), and asks less at 10 mph and above in the hard freezes, where
 * the rules do not advise sprinkling.
 */
class SprinklerRateTablesTest {
  private static final double MPH = 0.44704;
  private static final double IN_PER_H = 25.4;
  private static final double DEW_DEPRESSION_C = 3.0;
  private static final double WATER_C = 5.0;
  private static final double P_KPA = 101.325;

  private static final String MSU_CIRC287 = "UF/IFAS Circ. 287 as printed by MSU Extension,"
      + " \"Using your sprinkler system to protect blueberries from freezes\" (SEEN)";
  private static final String GERBER_HARRISON = "Gerber & Harrison wind-band table, UF/IFAS Circ. 287"
      + " / NC State Table 2 (MEMORY: recalled, not read; wider tolerance)";

  static double modelInH(double tempF, double windMph) {
    double airC = (tempF - 32) / 1.8;
    double wind2m = Wind.at2mMs(windMph * MPH, 10);
    return SprinklerBalance.requiredRateMmH(airC, airC - DEW_DEPRESSION_C, wind2m, WATER_C, P_KPA) / IN_PER_H;
  }

  private static final double[] BAND_MPH = {0.5, 3, 6.5, 12, 20};

  /** One table cell, the source it is from, and the model/table ratio it must fall in, and why. */
  record Cell(String source, int tempF, int band, double tableInH, double minRatio, double maxRatio,
      String why) {
    @Override
    public String toString() {
      return tempF + " °F, wind band " + band + ", " + tableInH + " in/h — " + source;
    }
  }

  static List<Cell> msuCells() {
    // Table A of docs/reference/sprinkling-rates.md, read in the MSU page (SEEN).
    double[][] rows = {
        {27, .10, .10, .14},
        {26, .10, .16, .30},
        {24, .12, .24, .50},
        {22, .16, .30, .60},
        {18, .20, .40, .70}};
    List<Cell> cells = new ArrayList<>();
    for (double[] row : rows) {
      int f = (int) row[0];
      for (int b = 0; b < 3; b++) {
        if (f == 27) {
          cells.add(new Cell(MSU_CIRC287, f, b, row[b + 1], 0.9, 2.1,
              "at 27 °F the table keeps its practical minimum; the model may ask up to twice that,"
                  + " never less"));
        } else {
          cells.add(new Cell(MSU_CIRC287, f, b, row[b + 1], 0.70, 1.45, "SEEN: within -30 %/+45 %"));
        }
      }
    }
    return cells;
  }

  static List<Cell> memoryCells() {
    // Table B of docs/reference/sprinkling-rates.md, from memory (MEMORY).
    double[][] rows = {
        {27, .10, .10, .10, .10, .20},
        {26, .10, .10, .14, .20, .40},
        {24, .10, .16, .30, .40, .80},
        {22, .12, .24, .50, .60, 1.20},
        {20, .18, .30, .60, .80, 1.60},
        {18, .24, .40, .70, 1.00, 2.00},
        {15, .30, .50, .90, 1.30, 2.50},
        {11, .40, .70, 1.20, 1.80, 3.30}};
    List<Cell> cells = new ArrayList<>();
    for (double[] row : rows) {
      int f = (int) row[0];
      for (int b = 0; b < 5; b++) {
        if (f >= 26) {
          cells.add(new Cell(GERBER_HARRISON, f, b, row[b + 1], 0.9, 4.0,
              "26-27 °F: the table holds near its 0.10 in/h minimum in wind; the model never asks less"));
        } else if (b == 4) {
          cells.add(new Cell(GERBER_HARRISON, f, b, row[b + 1], 0.35, 1.5,
              "18-22 mph, beyond the 10 mph sprinkling limit: the table rises with wind faster than"
                  + " the sqrt(u) of a cylinder"));
        } else {
          cells.add(new Cell(GERBER_HARRISON, f, b, row[b + 1], 0.55, 1.8, "MEMORY: within -45 %/+80 %"));
        }
      }
    }
    return cells;
  }

  static Stream<Arguments> cells() {
    return Stream.concat(msuCells().stream(), memoryCells().stream()).map(Arguments::of);
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("cells")
  void modelMeetsThePublishedCell(Cell c) {
    double ratio = modelInH(c.tempF(), BAND_MPH[c.band()]) / c.tableInH();
    assertThat(ratio).as("model/table at %s (%s)", c, c.why()).isBetween(c.minRatio(), c.maxRatio());
  }

  @Test
  void calibrationConstantIsTheLogMeanOfTheSeenTable() {
    // GROUND_AREA_FACTOR was fitted as the log-mean table/model ratio over the SEEN table's cells
    // from 18 to 26 °F; refitting must give the documented constant back within 0.05.
    double sum = 0;
    int n = 0;
    for (Cell c : msuCells()) {
      if (c.tempF() <= 26) {
        sum += Math.log(c.tableInH() / (modelInH(c.tempF(), BAND_MPH[c.band()])
            / SprinklerBalance.GROUND_AREA_FACTOR));
        n++;
      }
    }
    assertThat(Math.exp(sum / n)).isCloseTo(SprinklerBalance.GROUND_AREA_FACTOR,
        org.assertj.core.api.Assertions.within(0.05));
  }

  @Test
  void severalTimesTheCalmNeedAtFiveToEightMphInTheLowTwenties() {
    // Both printings of the Circ. 287 table ask several times the calm rate at 5-8 mph in the low
    // 20s °F (SEEN: 0.50/0.12 = 4.2 at 24 °F, 0.60/0.16 = 3.75 at 22 °F; MEMORY: 3.0 and 4.2).
    // A 10 mm iced cylinder gives about 2.9.
    for (int f : new int[] {22, 23, 24}) {
      double ratio = modelInH(f, 6.5) / modelInH(f, 0.5);
      assertThat(ratio).as("%d °F", f).isBetween(2.5, 3.5);
      assertThat(modelInH(f, 3) / modelInH(f, 0.5)).as("2-4 mph, %d °F", f).isBetween(1.5, 2.5);
    }
  }

  @Test
  void msuRuleOfThumbForStillAir() {
    // Longstroth (2012), MSU Extension: 0.12-0.15 in/h "protects plants to about 22 degrees F with
    // no wind" (SEEN). The middle of that range, at a dew point 3 °C below 22 °F, protects the
    // model's buds to within 3 °F of 22 °F ("about"; the model gives 24.7 °F).
    double dewC = (22 - 32) / 1.8 - DEW_DEPRESSION_C;
    SprinklerBalance.Protection p = SprinklerBalance.protection(0.135 * IN_PER_H, dewC,
        Wind.at2mMs(0.5 * MPH, 10), WATER_C, P_KPA, 0);
    assertThat(p.limit()).isEqualTo(SprinklerBalance.Limit.AIR_TEMPERATURE);
    assertThat(p.airTempC() * 1.8 + 32).isBetween(19.0, 25.0);
  }

  @Test
  void tenthOfAnInchInCalmAirHoldsToAbout27F() {
    // E. D. Smith, Agriculture 9(1):9 (2019), UGA: 0.10 in/h protects blueberries to 27 °F (SEEN,
    // abstract; it says "winds from 0 to 10 mph", and the model agrees only for calm air).
    assertThat(modelInH(27, 0.5)).isBetween(0.08, 0.13);
  }

  @Test
  void breezeCostsTheModelMoreThanTheMsuTextSays() {
    // MSU Extension (SEEN): 0.12-0.15 in/h protects "only to 26 degrees F if there is a slight
    // breeze (two to four mph)"; Longstroth (2012): "24 to 25 degrees F with a light wind". The model
    // is more cautious: in a 3 mph breeze it asks more than 0.15 in/h at 26 °F, but no more than
    // half as much again as the table's 0.16 in/h for that cell.
    assertThat(modelInH(26, 3)).isGreaterThan(0.15).isLessThan(0.16 * 1.5);
  }

  @Test
  void evansOrchardRateSitsBetweenCalmAndBreezy() {
    // R. G. Evans (USDA-ARS) in Good Fruit Grower: 70-80 gpm/acre (0.155-0.177 in/h) protects trees
    // to about 24 °F, no wind stated (SEEN). The model's need at 24 °F spans that range between
    // calm air and 5-8 mph.
    assertThat(modelInH(24, 0.5)).isLessThan(0.177);
    assertThat(modelInH(24, 6.5)).isGreaterThan(0.155);
  }
}
