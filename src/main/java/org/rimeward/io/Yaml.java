package org.rimeward.io;

import com.fasterxml.jackson.core.JacksonException;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.fasterxml.jackson.dataformat.yaml.YAMLParser;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One YAML document read into maps, lists and scalars that remember where they stand in the text
 * (line, column, character offsets). Messages use the lines; profile edits use the offsets to
 * change one value and keep the comments and layout around it, which a Jackson tree would lose.
 *
 * <p>Refused here, each with its line: a tab in the indentation (YAML indents with spaces), a key
 * given twice in one mapping (a parser would silently keep the last), a second document. Anchors,
 * aliases and merge keys ({@code <<: *defaults}) work: keys written beside a merge win over the
 * merged ones, as the YAML merge-key convention says.
 */
public final class Yaml {
  private Yaml() {}

  /** A node of the document; lines and columns count from 1, offsets from 0. */
  public sealed interface Node permits Scalar, MapNode, SeqNode {
    int line();

    int col();

    /** Offset of the node's first character. */
    int start();

    /** Offset just past the node's last character (the last scalar inside it). */
    int end();
  }

  /** A scalar's text as written (null for an empty value); {@code start}/{@code end} include quotes. */
  public record Scalar(String text, boolean isNull, int line, int col, int start, int end)
      implements Node {
    /** The text with outer blanks removed, or null when the value is empty. */
    public String value() {
      return isNull || text.isBlank() ? null : text.strip();
    }
  }

  /** A key and its value; {@code keyLine} is where the key was written. */
  public record Entry(String key, int keyLine, int keyCol, Node value) {}

  public record MapNode(Map<String, Entry> entries, boolean flow, int line, int col, int start,
      int end) implements Node {
    public Node get(String key) {
      Entry e = entries.get(key);
      return e == null ? null : e.value();
    }
  }

  public record SeqNode(List<Node> items, boolean flow, int line, int col, int start, int end)
      implements Node {}

  /** Parses {@code file}; {@code emptyHint} says what the file should start with when it is empty. */
  public static Node parse(TextFile file, String emptyHint) {
    return parse(file.text(), file.label(), emptyHint);
  }

  /**
   * Parses a document whose top is a mapping of keys; {@code shape} says what the keys are, for
   * the message when it is a list or a value.
   */
  public static MapNode parseMap(String text, String label, String emptyHint, String shape) {
    Node root = parse(text, label, emptyHint);
    if (root instanceof MapNode m) {
      return m;
    }
    throw BadInputException.at(label + ":" + root.line(), "the file is " + Fields.describe(root)
        + ", not a mapping of keys; " + shape);
  }

  public static Node parse(String text, String label, String emptyHint) {
    refuseTabIndent(text, label);
    try (JsonParser p = new YAMLFactory().createParser(text)) {
      JsonToken t = p.nextToken();
      if (t == null) {
        throw BadInputException.at(label, "the file is empty; " + emptyHint);
      }
      Node root = new Reader(p, text, label).read(t);
      if (p.nextToken() != null) {
        throw BadInputException.at(label + ":" + p.currentTokenLocation().getLineNr(),
            "a second YAML document starts here; keep one document per file (remove the '---'"
                + " and what follows)");
      }
      return root;
    } catch (JacksonException e) {
      JsonLocation l = e.getLocation();
      String where = l == null || l.getLineNr() <= 0 ? label : label + ":" + l.getLineNr();
      throw new BadInputException(where + ": not valid YAML (" + firstLine(e.getOriginalMessage())
          + "); check indentation, quoting, and a space after each colon", e);
    } catch (IOException e) {
      throw new BadInputException(label + ": could not read (" + Text.quote(e.getMessage()) + ")",
          e);
    }
  }

  /** The parser's reason without its multi-line excerpt of the file. */
  private static String firstLine(String message) {
    String m = message == null ? "unreadable" : message.strip();
    int nl = m.indexOf('\n');
    return Text.escape(nl < 0 ? m : m.substring(0, nl)).replaceAll("[:;]\\s*$", "");
  }

  private static void refuseTabIndent(String text, String label) {
    int line = 1;
    boolean atStart = true;
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (c == '\n') {
        line++;
        atStart = true;
      } else if (atStart && c == '\t') {
        throw BadInputException.at(label + ":" + line, "indented with a tab; YAML indents with"
            + " spaces only, so replace the tab with spaces");
      } else if (c != ' ' && c != '\r') {
        atStart = false;
      }
    }
  }

  private static final class Reader {
    private final JsonParser p;
    private final String text;
    private final String label;
    private final Map<String, Node> anchors = new HashMap<>();

    Reader(JsonParser p, String text, String label) {
      this.p = p;
      this.text = text;
      this.label = label;
    }

    Node read(JsonToken t) throws IOException {
      JsonLocation loc = p.currentTokenLocation();
      int line = loc.getLineNr();
      int col = loc.getColumnNr();
      int start = (int) loc.getCharOffset();
      Object anchor = p.getObjectId();
      Node node;
      if (t == JsonToken.START_OBJECT) {
        node = map(line, col, start);
      } else if (t == JsonToken.START_ARRAY) {
        boolean flow = start < text.length() && text.charAt(start) == '[';
        List<Node> items = new ArrayList<>();
        int end = start;
        JsonToken i;
        while ((i = p.nextToken()) != JsonToken.END_ARRAY) {
          Node v = read(i);
          items.add(v);
          end = Math.max(end, v.end());
        }
        if (flow) {
          end = (int) p.currentLocation().getCharOffset();
        }
        node = new SeqNode(List.copyOf(items), flow, line, col, start, end);
      } else if (p instanceof YAMLParser y && y.isCurrentAlias()) {
        node = anchors.get(p.getText());
        if (node == null) {
          throw BadInputException.at(label + ":" + line, "*" + p.getText() + " refers to no anchor"
              + " written above it; define '&" + p.getText() + "' first");
        }
        return node;
      } else if (t.isScalarValue()) {
        int end = (int) p.currentLocation().getCharOffset();
        boolean isNull = t == JsonToken.VALUE_NULL;
        node = new Scalar(isNull ? null : p.getText(), isNull, line, col, start, end);
      } else {
        throw BadInputException.at(label + ":" + line, "unexpected YAML structure here");
      }
      if (anchor != null) {
        anchors.put(anchor.toString(), node);
      }
      return node;
    }

    private MapNode map(int line, int col, int start) throws IOException {
      boolean flow = start < text.length() && text.charAt(start) == '{';
      Map<String, Entry> explicit = new LinkedHashMap<>();
      Map<String, Entry> merged = new LinkedHashMap<>();
      int end = start;
      while (p.nextToken() == JsonToken.FIELD_NAME) {
        JsonLocation kl = p.currentTokenLocation();
        String key = p.getText();
        Node v = read(p.nextToken());
        end = Math.max(end, v.end());
        if (key.equals("<<")) {
          merge(v, merged, kl.getLineNr());
          continue;
        }
        Entry previous = explicit.put(key, new Entry(key, kl.getLineNr(), kl.getColumnNr(), v));
        if (previous != null) {
          throw BadInputException.at(label + ":" + kl.getLineNr(), "'" + Text.escape(key)
              + "' is given twice in the same mapping (first on line " + previous.keyLine()
              + "); keep one");
        }
      }
      if (flow) {
        end = (int) p.currentLocation().getCharOffset();
      }
      Map<String, Entry> entries = new LinkedHashMap<>(explicit);
      merged.forEach(entries::putIfAbsent);
      return new MapNode(Collections.unmodifiableMap(entries), flow, line, col, start, end);
    }

    /** Adds the keys of a merged mapping (or list of mappings, earlier ones first) not yet present. */
    private void merge(Node v, Map<String, Entry> merged, int line) {
      if (v instanceof MapNode m) {
        m.entries().forEach(merged::putIfAbsent);
      } else if (v instanceof SeqNode s && s.items().stream().allMatch(MapNode.class::isInstance)) {
        s.items().forEach(i -> ((MapNode) i).entries().forEach(merged::putIfAbsent));
      } else {
        throw BadInputException.at(label + ":" + line, "'<<' merges a mapping; give it an alias of"
            + " one (<<: *defaults) or a list of them");
      }
    }
  }
}
