package org.rimeward.farm;

import com.fasterxml.jackson.core.JacksonException;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.io.IOException;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rimeward.io.BadInputException;

/**
 * A YAML document read into maps, lists and scalars that remember their line, so every later
 * message can say where in the file a value was written. Duplicate keys are refused here: a YAML
 * parser would silently keep the last one, and a grower would not know which value counted.
 */
final class YamlTree {
  private YamlTree() {}

  sealed interface Node permits MapNode, ListNode, Scalar {
    int line();
  }

  /** A key and its value; {@code keyLine} is where the key was written. */
  record Entry(String key, int keyLine, Node value) {}

  record MapNode(Map<String, Entry> entries, int line) implements Node {}

  record ListNode(List<Node> items, int line) implements Node {}

  /** A scalar's text as written, or null for an empty value; {@code token} tells a number from a string. */
  record Scalar(String text, JsonToken token, int line) implements Node {
    boolean isNull() {
      return token == JsonToken.VALUE_NULL;
    }
  }

  static Node parse(String text, String file) {
    YAMLFactory factory = YAMLFactory.builder().build();
    try (JsonParser p = factory.createParser(new StringReader(text))) {
      JsonToken t = p.nextToken();
      if (t == null) {
        throw BadInputException.at(file, "the file is empty; write the farm, water_sources and"
            + " blocks sections");
      }
      Node root = read(p, file);
      JsonToken next = p.nextToken();
      if (next != null) {
        throw BadInputException.at(file + ":" + line(p), "a second YAML document starts here;"
            + " keep one document per farm file");
      }
      return root;
    } catch (JacksonException e) {
      JsonLocation loc = e.getLocation();
      String where = loc != null && loc.getLineNr() > 0 ? file + ":" + loc.getLineNr() : file;
      throw withCause(where, "not valid YAML (" + e.getOriginalMessage()
          + "); check indentation and that every 'key: value' has a space after the colon", e);
    } catch (IOException e) {
      throw withCause(file, "could not read: " + e.getMessage(), e);
    }
  }

  private static int line(JsonParser p) {
    return p.currentTokenLocation().getLineNr();
  }

  private static Node read(JsonParser p, String file) throws IOException {
    JsonToken t = p.currentToken();
    int line = line(p);
    switch (t) {
      case START_OBJECT -> {
        Map<String, Entry> entries = new LinkedHashMap<>();
        while (p.nextToken() == JsonToken.FIELD_NAME) {
          String key = p.currentName();
          int keyLine = line(p);
          p.nextToken();
          Node value = read(p, file);
          Entry previous = entries.put(key, new Entry(key, keyLine, value));
          if (previous != null) {
            throw BadInputException.at(file + ":" + keyLine, "'" + key + "' is given twice (also on line "
                + previous.keyLine() + "); keep one");
          }
        }
        return new MapNode(Collections.unmodifiableMap(entries), line);
      }
      case START_ARRAY -> {
        List<Node> items = new ArrayList<>();
        while (p.nextToken() != JsonToken.END_ARRAY) {
          items.add(read(p, file));
        }
        return new ListNode(List.copyOf(items), line);
      }
      case VALUE_NULL -> {
        return new Scalar(null, t, line);
      }
      default -> {
        if (t.isScalarValue()) {
          return new Scalar(p.getText(), t, line);
        }
        throw BadInputException.at(file + ":" + line, "unexpected YAML token " + t);
      }
    }
  }

  private static BadInputException withCause(String where, String message, Throwable cause) {
    return new BadInputException(where + ": " + message, cause);
  }
}
