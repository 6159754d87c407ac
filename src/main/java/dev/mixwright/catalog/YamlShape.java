package dev.mixwright.catalog;

import java.io.StringReader;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.events.AliasEvent;
import org.yaml.snakeyaml.events.CollectionStartEvent;
import org.yaml.snakeyaml.events.Event;
import org.yaml.snakeyaml.events.NodeEvent;
import org.yaml.snakeyaml.events.ScalarEvent;

/**
 * Refuses the parts of YAML a catalog has no use for and that a tree reader would silently turn
 * into something else: tags ({@code !!set}, {@code !!binary}, {@code !custom}), which change what
 * a value is, and anchors and aliases ({@code &a}, {@code *a}, {@code <<: *a}), which can put a
 * value of the wrong type somewhere or multiply a small file into a huge tree. One pass over the
 * parser's events, O(size of the text) once lines are at most {@link Limits#MAX_YAML_LINE} long
 * (the caller checks that first: the parser is quadratic in the length of one token); syntax errors
 * are left to the tree reader, which reports them with their line and column.
 */
final class YamlShape {
  private YamlShape() {}

  static void check(String text, String name, LoaderOptions options) throws CatalogException {
    Yaml yaml = new Yaml(options);
    try {
      for (Event e : yaml.parse(new StringReader(text))) {
        String problem = null;
        if (e instanceof AliasEvent a) {
          problem =
              "uses the alias *"
                  + a.getAnchor()
                  + " — a catalog does not use YAML anchors and aliases; write the value out in"
                  + " full where it is needed";
        } else if (e instanceof NodeEvent n && n.getAnchor() != null) {
          problem =
              "sets the anchor &"
                  + n.getAnchor()
                  + " — a catalog does not use YAML anchors and aliases; remove it and write values"
                  + " out in full";
        } else {
          String tag =
              e instanceof ScalarEvent s
                  ? s.getTag()
                  : e instanceof CollectionStartEvent c ? c.getTag() : null;
          if (tag != null) {
            problem =
                "has the YAML tag "
                    + shortTag(tag)
                    + " — a catalog does not use tags; write plain values (quote text that"
                    + " would otherwise read as a number or a boolean)";
          }
        }
        if (problem != null) {
          throw new CatalogException(new CatalogProblem(at(name, e.getStartMark()), problem));
        }
      }
    } catch (YAMLException e) {
      // Not YAML at all: the tree reader reports it with line and column.
    }
  }

  private static String shortTag(String tag) {
    String standard = "tag:yaml.org,2002:";
    return tag.startsWith(standard) ? "!!" + tag.substring(standard.length()) : tag;
  }

  private static String at(String name, Mark m) {
    return m == null ? name : name + " line " + (m.getLine() + 1) + " column " + (m.getColumn() + 1);
  }
}
