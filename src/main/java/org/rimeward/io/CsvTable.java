package org.rimeward.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.apache.commons.csv.DuplicateHeaderMode;

/**
 * A table of values with a header line, read by Commons CSV, which maps the header to columns
 * (names compared without regard to case). What people's exports look like is accepted: comma,
 * semicolon or tab between values (the header line says which), decimal commas where values are
 * separated by semicolons or tabs (a European spreadsheet's export), {@code #} comment lines,
 * blank lines, and a typographic minus. Every row knows the line it was written on.
 *
 * <p>A file that grows while it is read (a logger's) is read as its {@link #header} and then one
 * line at a time ({@link #row}), so that a bad line costs that line and not the ones after it.
 */
public final class CsvTable {
  private static final Pattern DECIMAL_COMMA_SPLIT = Pattern.compile("(^|,)\\s*[+-\u2212]?\\d+,\\d");

  private final String label;
  private final char delimiter;
  private final List<String> columns;
  private final List<Row> rows;
  private final int headerLine;
  private CSVFormat rowFormat;

  private CsvTable(String label, char delimiter, List<String> columns, List<Row> rows,
      int headerLine) {
    this.label = label;
    this.headerLine = headerLine;
    this.delimiter = delimiter;
    this.columns = List.copyOf(columns);
    this.rows = List.copyOf(rows);
  }

  /** One data row: its line in the file and its values by column name. */
  public record Row(int line, CSVRecord record) {
    /** The trimmed value of {@code column}, or "" when the row is too short to have it. */
    public String get(String column) {
      return record.isSet(column) ? record.get(column).strip() : "";
    }

    public int size() {
      return record.size();
    }
  }

  /**
   * Reads {@code file}. {@code headerExample} shows a good first line in the message for an empty
   * file.
   */
  public static CsvTable read(TextFile file, String headerExample) {
    return parse(file.text(), file.label(), headerExample, 0);
  }

  /**
   * The table of a header line alone, the line {@code line} of the file {@code label}: rows are
   * then read one at a time by {@link #row}. Refused as {@link #read} refuses a header.
   */
  public static CsvTable header(String label, String headerLine, int line, String headerExample) {
    return parse(headerLine, label, headerExample, line - 1);
  }

  /**
   * One line of the file under this table's header, as line {@code line}: empty for a blank or
   * comment line.
   *
   * @throws BadInputException for a line that is not readable as CSV (an unbalanced quote)
   */
  public Optional<Row> row(String text, int line) {
    String stripped = text.strip();
    if (stripped.isEmpty() || stripped.startsWith("#")) {
      return Optional.empty();
    }
    if (rowFormat == null) {
      rowFormat = format(delimiter).builder().setHeader(columns.toArray(String[]::new))
          .setSkipHeaderRecord(false).get();
    }
    try (CSVParser parser = CSVParser.parse(text, rowFormat)) {
      List<CSVRecord> records = parser.getRecords();
      if (records.isEmpty() || Arrays.stream(records.get(0).values()).allMatch(String::isBlank)) {
        return Optional.empty();
      }
      return Optional.of(new Row(line, records.get(0)));
    } catch (IOException | UncheckedIOException | IllegalStateException e) {
      throw quoteProblem(text, label, new LineIndex(text), 0, line - 1, e);
    }
  }

  private static CSVFormat format(char delimiter) {
    return CSVFormat.DEFAULT.builder()
        .setDelimiter(delimiter)
        .setCommentMarker('#')
        .setIgnoreEmptyLines(true)
        .setIgnoreSurroundingSpaces(true)
        .setHeader()
        .setSkipHeaderRecord(true)
        .setIgnoreHeaderCase(true)
        .setDuplicateHeaderMode(DuplicateHeaderMode.DISALLOW)
        .setAllowMissingColumnNames(false)
        .get();
  }

  /** Parses {@code text}, whose first line is line {@code lineOffset} + 1 of the file. */
  private static CsvTable parse(String text, String label, String headerExample, int lineOffset) {
    char delimiter = delimiter(text);
    CSVFormat format = format(delimiter);
    LineIndex lines = new LineIndex(text);
    List<Row> rows = new ArrayList<>();
    long goodUpTo = 0;
    List<String> columns;
    try (CSVParser parser = CSVParser.parse(text, format)) {
      columns = parser.getHeaderNames().stream().map(String::strip).toList();
      if (columns.isEmpty()) {
        throw BadInputException.at(label, "the file is empty; the first line must name the"
            + " columns, e.g. " + headerExample);
      }
      for (CSVRecord r : parser) {
        goodUpTo = r.getCharacterPosition();
        if (Arrays.stream(r.values()).allMatch(String::isBlank)) {
          continue;
        }
        rows.add(new Row(lines.lineAt(r.getCharacterPosition()) + lineOffset, r));
      }
    } catch (IllegalArgumentException e) {
      // Commons CSV refuses a header with a blank or repeated name; say which.
      throw BadInputException.at(label + ":" + (lines.lineAt(0) + lineOffset), headerProblem(
          lines.firstContentLine(), delimiter) + ", e.g. " + headerExample);
    } catch (IOException | UncheckedIOException | IllegalStateException e) {
      throw quoteProblem(text, label, lines, goodUpTo, lineOffset, e);
    }
    return new CsvTable(label, delimiter, columns, rows, lines.lineAt(0) + lineOffset);
  }

  private static String headerProblem(String header, char delimiter) {
    List<String> names = Arrays.stream(header.strip().split(Pattern.quote(String.valueOf(delimiter)), -1))
        .map(n -> n.strip().replace("\"", "").toLowerCase(Locale.ROOT)).toList();
    for (int i = 0; i < names.size(); i++) {
      if (names.get(i).isEmpty()) {
        return "column " + (i + 1) + " has no name; name every column";
      }
      int j = names.subList(i + 1, names.size()).indexOf(names.get(i));
      if (j >= 0) {
        return "column " + Text.quote(names.get(i)) + " appears twice (columns " + (i + 1)
            + " and " + (i + 2 + j) + "); keep one";
      }
    }
    return "the header line cannot be read; give every column one name";
  }

  /** The separator the header line uses: whichever of tab, semicolon and comma it has most of. */
  static char delimiter(String text) {
    String header = new LineIndex(text).firstContentLine();
    int tabs = count(header, '\t');
    int semis = count(header, ';');
    int commas = count(header, ',');
    if (tabs > 0 && tabs >= semis && tabs >= commas) {
      return '\t';
    }
    return semis > commas ? ';' : ',';
  }

  private static int count(String s, char c) {
    int n = 0;
    boolean quoted = false;
    for (int i = 0; i < s.length(); i++) {
      char x = s.charAt(i);
      if (x == '"') {
        quoted = !quoted;
      } else if (x == c && !quoted) {
        n++;
      }
    }
    return n;
  }

  private static BadInputException quoteProblem(String text, String label, LineIndex lines,
      long from, int lineOffset, Exception e) {
    int quote = text.indexOf('"', (int) Math.min(from, text.length()));
    int line = lines.lineAt(quote >= 0 ? quote : from) + lineOffset;
    String why = String.valueOf(e.getMessage()).toLowerCase(Locale.ROOT);
    if (why.contains("eof") || why.contains("encapsulated")) {
      return new BadInputException(label + ":" + line + ": a quote (\") opens here and never"
          + " closes; close it or remove it", e);
    }
    return new BadInputException(label + ":" + line + ": not readable as CSV near here (a"
        + " quote in the middle of a value?); quote the whole value or remove the quote", e);
  }

  public String label() {
    return label;
  }

  /** The separator between values: ',', ';' or tab. */
  public char delimiter() {
    return delimiter;
  }

  /** Whether numbers may be written with a decimal comma (values separated by ';' or tab). */
  public boolean decimalComma() {
    return delimiter != ',';
  }

  /** The column names as written in the header. */
  public List<String> columns() {
    return columns;
  }

  /** The column names in lower case, the way readers compare them. */
  public List<String> columnsLowerCase() {
    return columns.stream().map(c -> c.toLowerCase(Locale.ROOT)).toList();
  }

  /** The data rows, blank ones left out. */
  public List<Row> rows() {
    return rows;
  }

  /** The line of the header. */
  public int headerLine() {
    return headerLine;
  }

  /** Throws when {@code row} has more or fewer values than the header has columns. */
  public void requireWidth(Row row) {
    if (row.size() == columns.size()) {
      return;
    }
    String hint = "give one value per column, in the header's order";
    String written = String.join(String.valueOf(delimiter), row.record().values());
    if (delimiter == ',' && row.size() > columns.size()
        && DECIMAL_COMMA_SPLIT.matcher(written).find()) {
      hint = "a decimal comma splits a number in two: use a decimal point (2.5), or separate the"
          + " columns with ';'";
    }
    throw BadInputException.at(label + ":" + row.line(), "has " + row.size() + " values but the"
        + " header names " + columns.size() + " columns; " + hint);
  }

  /**
   * The number in {@code column} of {@code row}.
   *
   * @throws BadInputException naming the line, column and value
   */
  public double number(Row row, String column) {
    String s = row.get(column);
    if (s.isEmpty()) {
      throw bad(row, column, "a value is required; fill the cell");
    }
    try {
      return Numbers.parse(s, decimalComma());
    } catch (Numbers.NotANumberException e) {
      String hint = Numbers.hint(Numbers.normalize(s));
      if (!hint.contains("decimal")) {
        hint = "write a plain number without its unit (the unit is in the column name), e.g. 2.5";
      }
      throw bad(row, column, "is not a number; " + hint);
    }
  }

  /** A problem with one cell: {@code file:line: column C, value 'V': what}. */
  public BadInputException bad(Row row, String column, String what) {
    return BadInputException.at(label + ":" + row.line(), "column " + column + ", value "
        + Text.quote(row.get(column)) + ": " + what);
  }

  /** Line numbers of character offsets, skipping blank and comment lines to a record's start. */
  static final class LineIndex {
    private final String text;
    private final int[] starts;

    LineIndex(String text) {
      this.text = text;
      List<Integer> s = new ArrayList<>();
      s.add(0);
      for (int i = 0; i < text.length(); i++) {
        char c = text.charAt(i);
        if (c == '\n' || c == '\r' && (i + 1 >= text.length() || text.charAt(i + 1) != '\n')) {
          s.add(i + 1);
        }
      }
      starts = s.stream().mapToInt(Integer::intValue).toArray();
    }

    /** The 1-based line of the first content at or after {@code pos}. */
    int lineAt(long pos) {
      int p = (int) Math.min(pos, text.length());
      while (p < text.length()) {
        char c = text.charAt(p);
        if (c == '#' && isLineStart(p)) {
          while (p < text.length() && text.charAt(p) != '\n' && text.charAt(p) != '\r') {
            p++;
          }
        } else if (Character.isWhitespace(c)) {
          p++;
        } else {
          break;
        }
      }
      int i = Arrays.binarySearch(starts, p);
      return (i >= 0 ? i : -i - 2) + 1;
    }

    private boolean isLineStart(int p) {
      return p == 0 || text.charAt(p - 1) == '\n' || text.charAt(p - 1) == '\r';
    }

    String firstContentLine() {
      int line = lineAt(0);
      int from = starts[line - 1];
      int to = line < starts.length ? starts[line] : text.length();
      return text.substring(from, to);
    }
  }
}
