package org.rimeward.audit;

import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/**
 * Runs shaped like the planner's, for the audit tests. The two blocks and their thresholds are a
 * demo orchard; the apple tight-cluster T10/T90 (-2.8/-6.1 °C) and the pear first-bloom T10/T90
 * (-2.8/-5.0 °C) are the WSU EB0913/EB0978 values as printed by Penn State Extension, "Orchard
 * Frost - Critical Temperatures for Various Fruits". The weather and water figures are invented.
 */
public final class AuditSamples {
  /** The chained schema-step records a new trail starts with: one per step from version 3 on. */
  public static final long SCHEMA_STEP_RECORDS =
      Schema.MIGRATIONS.stream().filter(m -> m.version() >= 3).count();

  private AuditSamples() {}

  public static final String PLAN_JSON = """
      {"night":{"date":"2026-04-15","sunset":"2026-04-15T19:58:00+02:00","sunrise":"2026-04-16T06:21:00+02:00"},
       "blocks":[
        {"block":"north-gala","crop":"apple","variety":"Gala","stage":"tight cluster",
         "t10_c":-2.8,"t90_c":-6.1,"target_c":-2.2,"min_air_c":-3.4,"min_bud_c":-3.9,
         "min_wet_bulb_c":-4.6,"coldest_at":"2026-04-16T05:40:00+02:00","risk":"high",
         "kill_pct_unprotected":22.0,"status":"protected",
         "actions":[{"method":"sprinkle","start":"2026-04-16T01:10:00+02:00",
           "stop":"2026-04-16T07:05:00+02:00","required_rate_mm_h":3.2,"installed_rate_mm_h":3.8,
           "water_m3":412.0,"source":"pond","water_granted":true}],
         "cautions":["wet-bulb falls below 0 °C by 23:40: start sprinklers before then"],
         "rules":[{"id":"risk.below-t10","explanation":"bud temperature -3.9 °C is below T10 -2.8 °C"},
                  {"id":"protect.sprinkle","kind":"decision","explanation":"sprinklers installed at 3.8 mm/h cover the required 3.2 mm/h"}]},
        {"block":"south-bartlett","crop":"pear","variety":"Bartlett","stage":"first bloom",
         "t10_c":-2.8,"t90_c":-5.0,"target_c":-2.2,"min_air_c":-1.1,"min_bud_c":-1.6,
         "min_wet_bulb_c":-2.3,"coldest_at":"2026-04-16T05:50:00+02:00","risk":"low",
         "kill_pct_unprotected":0.0,"status":"not-needed","actions":[],"cautions":[],
         "rules":[{"id":"risk.above-target","explanation":"bud temperature -1.6 °C stays above the target -2.2 °C"}]},
        {"block":"east-row-covers","crop":"strawberry","variety":"Chandler","stage":"full bloom",
         "t10_c":-2.2,"t90_c":-2.2,"target_c":-1.1,"min_air_c":-2.0,"min_bud_c":-2.6,
         "min_wet_bulb_c":-3.1,"coldest_at":"2026-04-16T05:30:00+02:00","risk":"moderate",
         "kill_pct_unprotected":10.0,"status":"protected",
         "actions":[{"method":"cover","deploy_start":"2026-04-15T17:30:00+02:00",
           "deploy_by":"2026-04-15T19:30:00+02:00","remove":"2026-04-16T09:00:00+02:00"}],
         "cautions":[],
         "rules":[{"id":"protect.cover","explanation":"covers are deployable before sunset"}]}],
       "water":[{"source":"pond","peak_flow_m3_h":72.0,"max_flow_m3_h":90.0,"volume_m3":412.0,
         "available_m3":1800.0,"short":false}],
       "cautions":["Decision support only: check thermometers at bud height in each block."]}
      """;

  public static RunRecord sampleRun(String runId, Instant ranAt, LocalDate night) {
    List<RecordedInput> inputs = List.of(
        RecordedInput.ofText(InputKind.FARM, "farm.yaml", "name: Hillside\nzone: Europe/Berlin\n"),
        RecordedInput.ofText(InputKind.FORECAST, "forecast/2026-04-15.csv",
            "time,air_c,dew_point_c,wind_ms\n2026-04-16T05:00+02:00,-3.2,-5.9,0.8\n"),
        RecordedInput.ofText(InputKind.CROP_PROFILE, "crop-profiles/apple.yaml",
            "tight cluster: {t10: -2.8C, t90: -6.1C}\n"),
        RecordedInput.of(InputKind.RULE, "rules/risk.drl", new byte[] {0, 1, 2, (byte) 0xff}),
        RecordedInput.of(InputKind.RULE, "rules/empty.drl", new byte[0]));
    List<RecordedBlock> blocks = List.of(
        new RecordedBlock("north-gala", "protected", "high", true, "{\"block\":\"north-gala\"}",
            List.of(new RecordedRule(1, "risk.below-t10", "bud temperature -3.9 °C is below T10"
                + " -2.8 °C", "{\"min_bud_c\":-3.9,\"t10_c\":-2.8}"),
                new RecordedRule(4, "protect.sprinkle", "sprinklers cover the required rate",
                    "{\"required_rate_mm_h\":3.2,\"installed_rate_mm_h\":3.8}"))),
        new RecordedBlock("south-bartlett", "not-needed", "low", false,
            "{\"block\":\"south-bartlett\"}", List.of(new RecordedRule(2, "risk.above-target",
                "stays above the target", "{\"min_bud_c\":-1.6,\"target_c\":-2.2}"))),
        new RecordedBlock("east-row-covers", "protected", "moderate", true,
            "{\"block\":\"east-row-covers\"}", List.of(new RecordedRule(3, "protect.cover",
                "covers are deployable before sunset", "{}"))));
    return new RunRecord(runId, ranAt, "0.1.0", "Hillside Orchard", night, "Europe/Berlin",
        "{\"margin_c\":0.6}", inputs, blocks,
        List.of("Decision support only: check thermometers at bud height in each block."), PLAN_JSON);
  }

  /**
   * A run of a fixed shape, so a reader can tell a whole one from a cut one: {@code inputCount}
   * inputs of {@code inputBytes} random bytes, {@code blockCount} blocks of {@code rulesPerBlock}
   * rules each.
   */
  public static RunRecord shapedRun(String runId, Instant ranAt, Random random, int inputCount,
      int inputBytes, int blockCount, int rulesPerBlock) {
    List<RecordedInput> inputs = new ArrayList<>();
    for (int i = 0; i < inputCount; i++) {
      byte[] b = new byte[inputBytes];
      random.nextBytes(b);
      inputs.add(RecordedInput.of(InputKind.FORECAST, "forecast/part-" + i + ".csv", b));
    }
    List<RecordedBlock> blocks = new ArrayList<>();
    for (int k = 0; k < blockCount; k++) {
      List<RecordedRule> rules = new ArrayList<>();
      for (int r = 0; r < rulesPerBlock; r++) {
        rules.add(new RecordedRule(r + 1, "rule-" + r, "explanation " + r,
            "{\"v\":" + random.nextInt(1000) + "}"));
      }
      blocks.add(new RecordedBlock("block-" + k, k % 2 == 0 ? "protected" : "not-needed",
          k % 2 == 0 ? "high" : "low", k % 2 == 0, "{\"block\":\"block-" + k + "\"}", rules));
    }
    return new RunRecord(runId, ranAt, "0.1.0", "Shape Farm", LocalDate.of(2026, 4, 15),
        "UTC", "{}", inputs, blocks, List.of(), "{\"night\":{},\"blocks\":[],\"water\":[],\"cautions\":[]}");
  }

  static byte[] utf8(String s) {
    return s.getBytes(StandardCharsets.UTF_8);
  }
}
