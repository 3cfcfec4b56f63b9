package org.rimeward.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

/** Problems of one file are reported together, one per line, and capped. */
class ProblemsTest {
  @Test
  void allProblemsAtOnce() {
    Problems p = new Problems("f.yaml");
    p.add(3, "a: wrong");
    p.add(0, "empty");
    assertThatThrownBy(p::throwIfAny).hasMessage("f.yaml:3: a: wrong" + System.lineSeparator()
        + "f.yaml: empty");
  }

  @Test
  void manyProblemsAreSummarised() {
    Problems p = new Problems("f.yaml");
    for (int i = 1; i <= 40; i++) {
      p.add(i, "bad");
    }
    assertThatThrownBy(p::throwIfAny).satisfies(e -> assertThat(e.getMessage().lines().toList())
        .hasSize(Problems.MAX_SHOWN + 1).last().asString().contains("and 15 more problems"));
  }
}
