package org.rimeward.audit;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** How a replayed plan document is compared with the recorded one. */
class ReplayDiffTest {
  static final ObjectMapper JSON = new ObjectMapper();

  static List<Replay.Difference> diff(String a, String b) throws Exception {
    List<Replay.Difference> out = new ArrayList<>();
    Replay.diff("", JSON.readTree(a), JSON.readTree(b), out);
    return out;
  }

  @Test
  void theToolVersionAndTheWayANumberIsWrittenAreNoDifference() throws Exception {
    assertThat(diff("{\"tool_version\":\"0.1.0\",\"x\":1.0}", "{\"tool_version\":\"0.2.0\",\"x\":1.00}"))
        .isEmpty();
  }

  @Test
  void blocksAreComparedByIdSoAReorderedPlanShowsTheRealChange() throws Exception {
    String a = "{\"blocks\":[{\"block\":\"a\",\"status\":\"protected\"},{\"block\":\"b\",\"status\":\"not-needed\"}]}";
    String b = "{\"blocks\":[{\"block\":\"b\",\"status\":\"protected\"},{\"block\":\"a\",\"status\":\"protected\"}]}";
    List<Replay.Difference> d = diff(a, b);
    assertThat(d).extracting(Replay.Difference::path)
        .containsExactly("/blocks/b/status", "/blocks (order)");
    assertThat(d.get(0).recorded().asText()).isEqualTo("not-needed");
    assertThat(d.get(0).now().asText()).isEqualTo("protected");
  }

  @Test
  void addedAndRemovedValuesAreNamed() throws Exception {
    List<Replay.Difference> d = diff("{\"a\":[1,2],\"gone\":true}", "{\"a\":[1,2,3]}");
    assertThat(d).extracting(Replay.Difference::path).containsExactly("/a/2", "/gone");
    assertThat(d.get(0).recorded()).isNull();
    assertThat(d.get(1).now()).isNull();
  }

  /** A run recorded by an older version lacks the keys added since: that is no difference. */
  @Test
  void aKeyTheRecordedRunDidNotWriteIsNoDifference() throws Exception {
    assertThat(diff("{\"blocks\":[{\"block\":\"a\",\"status\":\"protected\"}]}",
        "{\"blocks\":[{\"block\":\"a\",\"status\":\"protected\",\"stage_name\":\"Full bloom\"}]}"))
        .isEmpty();
  }

  @Test
  void rulesAreMatchedByIdAndTheirFiringOrderIsNoDifference() throws Exception {
    String a = "{\"blocks\":[{\"block\":\"a\",\"rules\":["
        + "{\"seq\":1,\"id\":\"WIND-BREEZY\",\"explanation\":\"windy\"},"
        + "{\"seq\":2,\"id\":\"RISK-DAMAGE\",\"explanation\":\"cold\"}]}]}";
    String b = "{\"blocks\":[{\"block\":\"a\",\"rules\":["
        + "{\"seq\":1,\"id\":\"RISK-DAMAGE\",\"explanation\":\"cold\"}]}]}";
    List<Replay.Difference> d = diff(a, b);
    assertThat(d).extracting(Replay.Difference::path).containsExactly("/blocks/a/rules/WIND-BREEZY");
    assertThat(d.get(0).now()).isNull();
  }

  @Test
  void cautionsAreComparedAsWhatCameAndWhatWent() throws Exception {
    List<Replay.Difference> d = diff("{\"cautions\":[\"x\",\"y\"]}", "{\"cautions\":[\"y\",\"z\"]}");
    assertThat(d).hasSize(2);
    assertThat(d.get(0).recorded().asText()).isEqualTo("x");
    assertThat(d.get(0).now()).isNull();
    assertThat(d.get(1).recorded()).isNull();
    assertThat(d.get(1).now().asText()).isEqualTo("z");
  }

  @Test
  void farmWideRulesAreToldApartByTheirSource() throws Exception {
    String a = "{\"farm_rules\":["
        + "{\"seq\":1,\"id\":\"WATER-BUDGET\",\"explanation\":\"pond ok\",\"values\":{\"s.sourceId\":\"pond\"}},"
        + "{\"seq\":2,\"id\":\"WATER-BUDGET\",\"explanation\":\"well ok\",\"values\":{\"s.sourceId\":\"well\"}}]}";
    String b = "{\"farm_rules\":["
        + "{\"seq\":1,\"id\":\"WATER-BUDGET\",\"explanation\":\"well ok\",\"values\":{\"s.sourceId\":\"well\"}}]}";
    List<Replay.Difference> d = diff(a, b);
    assertThat(d).extracting(Replay.Difference::path).containsExactly("/farm_rules/WATER-BUDGET@pond");
    assertThat(d.get(0).now()).isNull();
  }
}
