package org.rimeward.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** The one CSV reading: header mapping, separators, comments, decimal commas, line numbers. */
class CsvTableTest {
  static CsvTable table(String text) {
    return CsvTable.read(TextFile.decode("t.csv", text.getBytes(StandardCharsets.UTF_8)), "a,b");
  }

  @Test
  void headerMapsColumnsWhateverTheirCaseAndRowsKnowTheirLines() {
    CsvTable t = table("# exported by hand\nTime, Air \n\n1,2\n# a comment between rows\n3,4\n");
    assertThat(t.columnsLowerCase()).containsExactly("time", "air");
    assertThat(t.headerLine()).isEqualTo(2);
    assertThat(t.rows()).extracting(CsvTable.Row::line).containsExactly(4, 6);
    assertThat(t.rows().get(1).get("air")).isEqualTo("4");
    assertThat(t.rows().get(1).get("AIR")).isEqualTo("4");
  }

  @Test
  void semicolonExportWithDecimalCommasIsRead() {
    CsvTable t = table("a;b\n\u22122,5;3,75\n");
    assertThat(t.delimiter()).isEqualTo(';');
    assertThat(t.number(t.rows().get(0), "a")).isEqualTo(-2.5);
    assertThat(t.number(t.rows().get(0), "b")).isEqualTo(3.75);
  }

  @Test
  void tabSeparatedExportIsRead() {
    CsvTable t = table("a\tb\n1.5\t2\n");
    assertThat(t.delimiter()).isEqualTo('\t');
    assertThat(t.number(t.rows().get(0), "a")).isEqualTo(1.5);
  }

  @Test
  void decimalCommaInACommaFileSaysUseADecimalPoint() {
    CsvTable t = table("a,b\n1,5,2\n");
    assertThatThrownBy(() -> t.requireWidth(t.rows().get(0)))
        .hasMessage("t.csv:2: has 3 values but the header names 2 columns; a decimal comma splits a"
            + " number in two: use a decimal point (2.5), or separate the columns with ';'");
  }

  @Test
  void unbalancedQuoteNamesTheLineWhereItOpens() {
    assertThatThrownBy(() -> table("a,b\n1,2\n\"3,4\n5,6\n"))
        .isInstanceOf(BadInputException.class)
        .hasMessage("t.csv:3: a quote (\") opens here and never closes; close it or remove it");
  }

  @Test
  void aHeaderAloneThenRowsOneAtATimeKeepTheFilesLines() {
    CsvTable t = CsvTable.header("log.csv", "Time;Air", 3, "time,air");
    assertThat(t.headerLine()).isEqualTo(3);
    assertThat(t.delimiter()).isEqualTo(';');
    CsvTable.Row row = t.row("7;2,5", 9).orElseThrow();
    assertThat(row.line()).isEqualTo(9);
    assertThat(t.number(row, "air")).isEqualTo(2.5);
    assertThat(t.row("# a comment", 10)).isEmpty();
    assertThat(t.row("   ", 11)).isEmpty();
    assertThatThrownBy(() -> t.row("8;\"3", 12)).isInstanceOf(BadInputException.class)
        .hasMessage("log.csv:12: a quote (\") opens here and never closes; close it or remove it");
    assertThatThrownBy(() -> t.number(t.row("8;x", 13).orElseThrow(), "air"))
        .hasMessageStartingWith("log.csv:13: column air, value 'x': is not a number");
    assertThatThrownBy(() -> CsvTable.header("log.csv", "time;;air", 4, "time,air"))
        .hasMessageStartingWith("log.csv:4: column 2 has no name");
  }

  @Test
  void hugeCellIsQuotedShort() {
    String cell = "x".repeat(3_000_000);
    CsvTable t = table("a,b\n" + cell + ",1\n");
    assertThatThrownBy(() -> t.number(t.rows().get(0), "a"))
        .hasMessageStartingWith("t.csv:2: column a, value 'xxxxxxxx")
        .hasMessageContaining("... (3000000 characters)")
        .satisfies(e -> assertThat(e.getMessage().length()).isLessThan(250));
  }

  @Test
  void repeatedOrBlankColumnNamesAreNamed() {
    assertThatThrownBy(() -> table("a,b,A\n1,2,3\n"))
        .hasMessageContaining("t.csv:1: column 'a' appears twice (columns 1 and 3)");
    assertThatThrownBy(() -> table("a,,b\n1,2,3\n"))
        .hasMessageContaining("t.csv:1: column 2 has no name");
  }
}
