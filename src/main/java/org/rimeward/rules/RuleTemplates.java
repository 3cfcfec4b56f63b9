package org.rimeward.rules;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The explanation templates of rule files, read from their text without compiling them: a
 * recorded run keeps its rule files' bytes, so its explanations can be put in other units long
 * after the rules changed, and reading text runs none of the code a rule file may hold.
 */
public final class RuleTemplates {
  private static final Pattern RULE_OR_EXPLAIN = Pattern.compile(
      "(?m)^\\s*rule\\s+\"([^\"]+)\"|@explain\\(\\s*\"((?:[^\"\\\\]|\\\\.)*)\"\\s*\\)");

  private RuleTemplates() {}

  /** Rule id → its {@code @explain} template, over every file's text; a later file wins. */
  public static Map<String, String> read(List<String> drlTexts) {
    Map<String, String> out = new LinkedHashMap<>();
    for (String text : drlTexts) {
      String rule = null;
      Matcher m = RULE_OR_EXPLAIN.matcher(text);
      while (m.find()) {
        if (m.group(1) != null) {
          rule = m.group(1);
        } else if (rule != null) {
          out.put(rule, unescape(m.group(2)));
          rule = null;
        }
      }
    }
    return out;
  }

  private static String unescape(String literal) {
    StringBuilder sb = new StringBuilder(literal.length());
    for (int i = 0; i < literal.length(); i++) {
      char c = literal.charAt(i);
      if (c == '\\' && i + 1 < literal.length()) {
        char n = literal.charAt(++i);
        sb.append(switch (n) {
          case 'n' -> '\n';
          case 't' -> '\t';
          default -> n;
        });
      } else {
        sb.append(c);
      }
    }
    return sb.toString();
  }
}
