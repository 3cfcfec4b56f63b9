package org.rimeward.audit;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.rimeward.io.BundledData;
import org.rimeward.plan.BlockPlan;
import org.rimeward.plan.NightPlanner;
import org.rimeward.plan.Plan;
import org.rimeward.plan.PlanJson;
import org.rimeward.plan.PlanRequest;
import org.rimeward.rules.FiredRule;

/** The record of a real demo-farm plan: nothing the plan read or decided is left out. */
class RunRecorderTest {
  static final ObjectMapper JSON = new ObjectMapper();
  static final Instant AT = Instant.parse("2026-04-15T02:10:00Z");
  static Plan plan;
  static RunRecord rec;

  @BeforeAll
  static void planTheDemoFarm() {
    plan = new NightPlanner().plan(new PlanRequest(Path.of("demo-farm"), null,
        BundledData.folder("crop-profiles"), BundledData.folder("rules"), null));
    rec = RunRecorder.toRecord(plan, AT);
  }

  @Test
  void theRunIsStampedWithTheGivenTimeAndCarriesThePlanDocument() throws Exception {
    assertThat(rec.runId()).startsWith("2026-04-15T021000.000Z-");
    assertThat(rec.ranAt()).isEqualTo(AT);
    assertThat(rec.night()).isEqualTo(plan.night().date());
    assertThat(rec.zoneId()).isEqualTo("America/Los_Angeles");
    assertThat(rec.farmName()).isEqualTo(plan.farmName());
    assertThat(rec.toolVersion()).isEqualTo(plan.toolVersion());
    assertThat(rec.planJson()).isEqualTo(PlanJson.toText(plan));
    assertThat(JSON.readTree(rec.policyJson())).isEqualTo(reparse(PlanJson.toTree(plan).get("policy")));
    assertThat(rec.cautions()).isEqualTo(plan.cautions());
  }

  @Test
  void everyInputIsKeptByteForByteWithItsHash() throws Exception {
    List<Path> expected = new ArrayList<>(List.of(Path.of("demo-farm/farm.yaml"),
        Path.of("demo-farm/forecast.csv")));
    try (Stream<Path> s = Files.list(BundledData.folder("crop-profiles"))) {
      expected.addAll(s.filter(Files::isRegularFile).sorted().toList());
    }
    Path rules = BundledData.folder("rules");
    try (Stream<Path> s = Files.walk(rules)) {
      expected.addAll(s.filter(p -> p.toString().endsWith(".drl")).sorted().toList());
    }
    assertThat(rec.inputs()).hasSize(expected.size());
    for (int i = 0; i < expected.size(); i++) {
      RecordedInput in = rec.inputs().get(i);
      assertThat(in.content()).as(in.name()).isEqualTo(Files.readAllBytes(expected.get(i)));
      assertThat(in.sha256()).isEqualTo(RecordedInput.sha256Hex(Files.readAllBytes(expected.get(i))));
    }
    assertThat(rec.inputs().stream().filter(i -> i.kind() == InputKind.RULE).map(RecordedInput::name))
        .contains("sprinkling/start.drl", "risk/risk.drl");
  }

  @Test
  void everyBlockRuleIsRecordedInFiringOrderWithTheValuesItSaw() throws Exception {
    assertThat(rec.blocks()).extracting(RecordedBlock::blockId)
        .containsExactlyElementsOf(plan.blocks().stream().map(BlockPlan::blockId).toList());
    JsonNode tree = reparse(PlanJson.toTree(plan));
    for (int b = 0; b < plan.blocks().size(); b++) {
      BlockPlan bp = plan.blocks().get(b);
      RecordedBlock rb = rec.blocks().get(b);
      assertThat(rb.protectionNeeded()).isEqualTo(bp.needsAction());
      assertThat(JSON.readTree(rb.decisionJson())).isEqualTo(tree.get("blocks").get(b));
      assertThat(rb.status()).isEqualTo(tree.get("blocks").get(b).get("status").asText());
      assertThat(rb.risk()).isEqualTo(tree.get("blocks").get(b).get("risk").asText());
      assertThat(rb.rules()).hasSize(bp.rules().size());
      for (int i = 0; i < bp.rules().size(); i++) {
        FiredRule f = bp.rules().get(i);
        RecordedRule r = rb.rules().get(i);
        assertThat(r.seq()).isEqualTo(f.seq());
        assertThat(r.ruleId()).isEqualTo(f.ruleId());
        assertThat(r.explanation()).isEqualTo(f.explanation());
        JsonNode facts = JSON.readTree(r.factsJson());
        assertThat(facts.size()).as(f.ruleId()).isEqualTo(f.values().size());
        f.values().keySet().forEach(k -> assertThat(facts.has(k)).as(f.ruleId() + " " + k).isTrue());
      }
    }
  }

  @Test
  void farmWideRulesAreInThePlanDocumentSoTheWholeTrailIsKept() throws Exception {
    List<FiredRule> farmWide = plan.trail().stream().filter(f -> f.blockId() == null).toList();
    assertThat(farmWide).extracting(FiredRule::ruleId).contains("WATER-SHORT");
    JsonNode recorded = JSON.readTree(rec.planJson()).get("farm_rules");
    assertThat(recorded).hasSize(farmWide.size());
    for (int i = 0; i < farmWide.size(); i++) {
      assertThat(recorded.get(i).get("seq").asInt()).isEqualTo(farmWide.get(i).seq());
      assertThat(recorded.get(i).get("explanation").asText()).isEqualTo(farmWide.get(i).explanation());
    }
    // Block rules plus farm-wide rules are the whole trail, each firing once.
    long blockRules = rec.blocks().stream().mapToLong(b -> b.rules().size()).sum();
    assertThat(blockRules + farmWide.size()).isEqualTo(plan.trail().size());
  }

  /** As read back from text, so 1.00 and 1.0 compare equal as they do in JSON. */
  static JsonNode reparse(JsonNode n) throws Exception {
    return JSON.readTree(JSON.writeValueAsString(n));
  }

  @Test
  void theRecordRoundTripsThroughTheStore(@org.junit.jupiter.api.io.TempDir Path dir) {
    try (AuditStore store = AuditStore.open(dir.resolve("audit.db"))) {
      store.appendRun(rec);
      RunRecord back = store.loadRun(rec.runId()).orElseThrow();
      assertThat(back).isEqualTo(rec);
      assertThat(store.verify().intact()).isTrue();
    }
  }
}
