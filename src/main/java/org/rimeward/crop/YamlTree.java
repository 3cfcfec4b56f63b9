package org.rimeward.crop;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rimeward.io.BadInputException;

/**
 * A YAML document read into maps, sequences and scalars that remember where they stand in the
 * text (line, column, character offsets). Error messages use the lines; profile edits use the
 * offsets to change one value without touching the comments and layout around it, which a
 * Jackson tree would lose.
 */
final class YamlTree {
  private YamlTree() {}

  sealed interface Node permits Scalar, MapNode, SeqNode {
    /** 1-based line of the node's first character. */
    int line();

    /** 1-based column of the node's first character. */
    int col();

    /** Offset of the node's first character. */
    int start();

    /** Offset just past the node's last character (the last scalar inside it). */
    int end();
  }

  /** A scalar; {@code start}/{@code end} cover its text including quotes. */
  record Scalar(String text, boolean isNull, int line, int col, int start, int end) implements Node {}

  record Entry(String key, int keyLine, int keyCol, Node value) {}

  record MapNode(Map<String, Entry> entries, boolean flow, int line, int col, int start, int end)
      implements Node {
    Node get(String key) {
      Entry e = entries.get(key);
      return e == null ? null : e.value();
    }
  }

  record SeqNode(List<Node> items, boolean flow, int line, int col, int start, int end)
      implements Node {}

  static MapNode parse(String text, String file) {
    try (JsonParser p = new YAMLFactory().createParser(text)) {
      JsonToken t = p.nextToken();
      if (t == null) {
        throw BadInputException.at(file, "the file is empty; a crop profile starts with 'crop: NAME'");
      }
      Node root = read(p, t, text, file);
      if (!(root instanceof MapNode m)) {
        throw BadInputException.at(file + ":" + root.line(),
            "a crop profile is a mapping of keys (crop:, name:, stages: ...), not a list or a value");
      }
      if (p.nextToken() != null) {
        throw BadInputException.at(file + ":" + p.currentTokenLocation().getLineNr(),
            "only one YAML document per crop file; remove the '---' and what follows");
      }
      return m;
    } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
      JsonLocation l = e.getLocation();
      String where = l == null ? file : file + ":" + l.getLineNr();
      throw BadInputException.at(where, "not valid YAML (" + e.getOriginalMessage()
          + "); check indentation and quoting on this line");
    } catch (IOException e) {
      throw new BadInputException(file + ": cannot be read: " + e.getMessage(), e);
    }
  }

  private static Node read(JsonParser p, JsonToken t, String text, String file) throws IOException {
    JsonLocation loc = p.currentTokenLocation();
    int line = loc.getLineNr();
    int col = loc.getColumnNr();
    int start = (int) loc.getCharOffset();
    switch (t) {
      case START_OBJECT: {
        boolean flow = start < text.length() && text.charAt(start) == '{';
        Map<String, Entry> entries = new LinkedHashMap<>();
        int end = start;
        JsonToken k;
        while ((k = p.nextToken()) == JsonToken.FIELD_NAME) {
          JsonLocation kl = p.currentTokenLocation();
          String key = p.getText();
          if (entries.containsKey(key)) {
            throw BadInputException.at(file + ":" + kl.getLineNr(), "key '" + key
                + "' appears twice in the same mapping (first on line "
                + entries.get(key).keyLine() + "); keep one");
          }
          Node v = read(p, p.nextToken(), text, file);
          entries.put(key, new Entry(key, kl.getLineNr(), kl.getColumnNr(), v));
          end = Math.max(end, v.end());
        }
        if (flow) {
          end = (int) p.currentLocation().getCharOffset();
        }
        return new MapNode(Collections.unmodifiableMap(entries), flow, line, col, start, end);
      }
      case START_ARRAY: {
        boolean flow = start < text.length() && text.charAt(start) == '[';
        List<Node> items = new ArrayList<>();
        int end = start;
        JsonToken i;
        while ((i = p.nextToken()) != JsonToken.END_ARRAY) {
          Node v = read(p, i, text, file);
          items.add(v);
          end = Math.max(end, v.end());
        }
        if (flow) {
          end = (int) p.currentLocation().getCharOffset();
        }
        return new SeqNode(List.copyOf(items), flow, line, col, start, end);
      }
      default: {
        if (!t.isScalarValue()) {
          throw BadInputException.at(file + ":" + line, "unexpected YAML structure " + t);
        }
        int end = (int) p.currentLocation().getCharOffset();
        boolean isNull = t == JsonToken.VALUE_NULL;
        return new Scalar(isNull ? null : p.getText(), isNull, line, col, start, end);
      }
    }
  }
}
