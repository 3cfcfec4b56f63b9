package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.Json;
import org.rimeward.units.UnitSystem;

/**
 * A block granted no water keeps its sprinklers off: no start or stop a crew could read as
 * "sprinkle", no frost alarm that would read as "get ready to", and a row that says what to do
 * instead, in every format. On the invented demo farm: creek-rome is left without water by the
 * short pond, west-pear's 2.5 mm/h is short of its need and not advised.
 */
class DryBlocksTest {
  private static final List<String> DRY = List.of("creek-rome", "west-pear");
  @TempDir static Path tmp;
  static Plan demo;

  @BeforeAll
  static void planTheDemo() {
    demo = TimelineTest.demo(tmp);
  }

  @Test
  void theDemoPlansTwoDryBlocks() {
    PlanDocument doc = PlanDocuments.of(demo);
    assertThat(doc.block("creek-rome").orElseThrow().status()).isEqualTo("short-of-water");
    assertThat(doc.block("west-pear").orElseThrow().status()).isEqualTo("not-advised");
    for (String id : DRY) {
      assertThat(doc.block(id).orElseThrow().sprinkle().orElseThrow().waterGranted()).as(id).isFalse();
    }
  }

  @Test
  void theTextGivesThemNoTimeAndNoAlarmAndSaysKeepSprinklersOff() {
    String text = PlanText.render(demo, UnitSystem.METRIC, false);
    String table = text.substring(text.indexOf("  block  "), text.indexOf("\nWater\n"));
    for (String id : DRY) {
      List<String> rows = rows(table, id);
      assertThat(rows).as(id).isNotEmpty();
      assertThat(String.join("\n", rows)).as(id).doesNotContainPattern("\\d\\d:\\d\\d")
          .doesNotContain("alarm", "start at", "START NOW").contains("keep sprinklers off");
    }
    String timeline = text.substring(0, text.indexOf("  block  "));
    assertThat(timeline).doesNotContain("creek-rome", "west-pear");
  }

  @Test
  void theJsonHasNullTimesNoAlarmAndNoTimelineEntry() throws IOException {
    JsonNode root = Json.mapper().readTree(PlanJson.toText(demo));
    for (JsonNode b : root.get("blocks")) {
      if (!DRY.contains(b.get("block").asText())) {
        continue;
      }
      JsonNode s = b.get("actions").get(0);
      assertThat(s.get("method").asText()).isEqualTo("sprinkle");
      assertThat(s.get("water_granted").asBoolean()).isFalse();
      assertThat(s.get("start").isNull()).as(b.toString()).isTrue();
      assertThat(s.get("stop").isNull()).isTrue();
      assertThat(b.has("alarm_at")).isFalse();
      assertThat(b.has("alarm_air_c")).isFalse();
      // The need and the reason stay, for the manager to weigh.
      assertThat(b.get("required_rate_mm_h").isNumber()).isTrue();
    }
    for (JsonNode e : root.get("timeline")) {
      assertThat(DRY).doesNotContain(e.path("block").asText());
    }
  }

  @Test
  void theCsvSaysSprinklersOffWithNoTimes() throws IOException {
    String csv = PlanCsv.render(demo);
    List<CSVRecord> rows = new ArrayList<>();
    for (CSVRecord r : CSVFormat.DEFAULT.builder().setHeader().get().parse(new StringReader(csv))) {
      if (DRY.contains(r.get("block"))) {
        rows.add(r);
      }
    }
    assertThat(rows).hasSize(2);
    for (CSVRecord r : rows) {
      assertThat(r.get("method")).as(r.get("block")).isEqualTo("sprinklers-off");
      assertThat(r.get("start")).isEmpty();
      assertThat(r.get("stop")).isEmpty();
      assertThat(r.get("water_granted")).isEqualTo("false");
    }
  }

  /** A block's rows of the table: its first row and the continuation rows under it. */
  static List<String> rows(String table, String id) {
    List<String> out = new ArrayList<>();
    boolean in = false;
    for (String line : table.lines().toList()) {
      if (line.startsWith("  " + id + " ")) {
        in = true;
      } else if (in && !line.startsWith("   ")) {
        break;
      }
      if (in) {
        out.add(line);
      }
    }
    return out;
  }
}
