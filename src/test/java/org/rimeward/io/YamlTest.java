package org.rimeward.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.rimeward.io.Yaml.MapNode;
import org.rimeward.io.Yaml.Scalar;

/** The one YAML reading: lines and offsets kept, merge keys, tabs and repeated keys refused. */
class YamlTest {
  static MapNode map(String text) {
    return Yaml.parseMap(text, "f.yaml", "write something", "keys");
  }

  @Test
  void nodesKnowTheirLinesAndOffsets() {
    String text = "a: 1\nb:\n  c: \"two\"\n";
    MapNode m = map(text);
    assertThat(m.entries().get("b").keyLine()).isEqualTo(2);
    Scalar c = (Scalar) ((MapNode) m.get("b")).get("c");
    assertThat(c.line()).isEqualTo(3);
    assertThat(text.substring(c.start(), c.end())).isEqualTo("\"two\"");
  }

  @Test
  void mergeKeysMergeAndKeysBesideThemWin() {
    MapNode m = map("base: &b\n  x: 1\n  y: 2\nuse:\n  <<: *b\n  y: 3\n");
    MapNode use = (MapNode) m.get("use");
    assertThat(((Scalar) use.get("x")).text()).isEqualTo("1");
    assertThat(((Scalar) use.get("y")).text()).isEqualTo("3");
  }

  @Test
  void tabIndentationIsRefusedWithItsLine() {
    assertThatThrownBy(() -> map("a:\n\tb: 1\n"))
        .isInstanceOf(BadInputException.class)
        .hasMessage("f.yaml:2: indented with a tab; YAML indents with spaces only, so replace the"
            + " tab with spaces");
  }

  @Test
  void repeatedKeyAndSecondDocumentAreRefused() {
    assertThatThrownBy(() -> map("a: 1\na: 2\n"))
        .hasMessage("f.yaml:2: 'a' is given twice in the same mapping (first on line 1); keep one");
    assertThatThrownBy(() -> map("a: 1\n---\nb: 2\n")).hasMessageContaining("a second YAML document");
  }

  @Test
  void brokenYamlIsOneShortLine() {
    assertThatThrownBy(() -> map("a: [1, 2\nb: 3\n"))
        .hasMessageStartingWith("f.yaml:")
        .hasMessageContaining("not valid YAML")
        .satisfies(e -> assertThat(e.getMessage()).doesNotContain("\n"));
  }
}
