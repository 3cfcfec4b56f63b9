package org.rimeward.report;

import com.github.mustachejava.DefaultMustacheFactory;
import com.github.mustachejava.Mustache;
import com.github.mustachejava.MustacheFactory;
import java.io.StringWriter;

/**
 * Renders a page model with its Mustache template ({@code org/rimeward/report/*.mustache}, in the
 * jar). Templates escape every value; only the charts, which JFreeSVG drew, go in raw.
 */
final class Pages {
  private static final MustacheFactory TEMPLATES = new DefaultMustacheFactory("org/rimeward/report");

  private Pages() {}

  static String render(String template, Object model) {
    Mustache m = TEMPLATES.compile(template + ".mustache");
    StringWriter out = new StringWriter();
    m.execute(out, model);
    return out.toString();
  }
}
