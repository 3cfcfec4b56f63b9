package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.time.ZoneId;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.rimeward.units.UnitSystem;

/** Reusing formatted values must render every explanation exactly as formatting afresh. */
class ExplanationsMemoTest {
  static final String TEMPLATE = "{b.t10C} at {at}; {n.airC} air, {n.offsetC} offset, {w.flowM3H},"
      + " {w.volumeM3}, {s.rateMmH}, {s.windMs}, {b.areaHa}, {n.killPct}, {count}, {plain}, {flag}";

  @ParameterizedTest
  @ValueSource(longs = {1, 2, 3, 42})
  void memoisedRenderingEqualsFreshRendering(long seed) {
    Random rnd = new Random(seed);
    ZoneId zone = ZoneId.of("America/Los_Angeles");
    for (UnitSystem units : UnitSystem.values()) {
      Map<List<Object>, String> memo = new HashMap<>();
      for (int i = 0; i < 2000; i++) {
        // Few distinct values, so the memo is hit often; signed zeros and NaN included.
        double[] pool = {-0.0, 0.0, -2.25, -2.35, 1.05, Double.NaN, Double.POSITIVE_INFINITY, 12.5};
        Map<String, Object> values = new HashMap<>();
        values.put("b.t10C", pool[rnd.nextInt(pool.length)]);
        values.put("at", Instant.parse("2026-04-15T12:00:00Z").plusSeconds(900L * rnd.nextInt(8)));
        values.put("n.airC", pool[rnd.nextInt(pool.length)]);
        values.put("n.offsetC", pool[rnd.nextInt(pool.length)]);
        values.put("w.flowM3H", pool[rnd.nextInt(pool.length)]);
        values.put("w.volumeM3", pool[rnd.nextInt(pool.length)]);
        values.put("s.rateMmH", pool[rnd.nextInt(pool.length)]);
        values.put("s.windMs", pool[rnd.nextInt(pool.length)]);
        values.put("b.areaHa", pool[rnd.nextInt(pool.length)]);
        values.put("n.killPct", pool[rnd.nextInt(pool.length)]);
        values.put("count", rnd.nextInt(3));
        values.put("plain", rnd.nextBoolean() ? (Object) 2 : (Object) 2.0);
        values.put("flag", rnd.nextBoolean());
        assertThat(Explanations.render(TEMPLATE, values, units, zone, memo))
            .isEqualTo(Explanations.render(TEMPLATE, values, units, zone));
      }
      assertThat(memo).isNotEmpty();
    }
  }
}
