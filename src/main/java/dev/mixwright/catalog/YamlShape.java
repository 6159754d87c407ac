package dev.mixwright.catalog;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.ObjectCodec;
import com.fasterxml.jackson.core.io.IOContext;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactoryBuilder;
import com.fasterxml.jackson.dataformat.yaml.YAMLParser;
import java.io.CharArrayReader;
import java.io.IOException;
import java.io.Reader;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.events.AliasEvent;
import org.yaml.snakeyaml.events.CollectionStartEvent;
import org.yaml.snakeyaml.events.Event;
import org.yaml.snakeyaml.events.NodeEvent;
import org.yaml.snakeyaml.events.ScalarEvent;

/**
 * Refuses the parts of YAML a catalog has no use for and that a tree reader would silently turn
 * into something else: tags ({@code !!set}, {@code !!binary}, {@code !custom}), which change what
 * a value is, and anchors and aliases ({@code &a}, {@code *a}, {@code <<: *a}), which can put a
 * value of the wrong type somewhere or multiply a small file into a huge tree. It looks at every
 * event of the tree reader's own parse ({@link Factory}: Jackson's YAML parser pulls each event
 * through {@code getEvent()}), so the text is parsed once: a separate pass of SnakeYAML's parser
 * cost about 0.2 s of CPU on a cold JVM, measured, a fifth of a solve's time before its first
 * round. O(size of the text) once lines are at most {@link Limits#MAX_YAML_LINE} long (the caller
 * checks that first: the parser is quadratic in the length of one token). Syntax errors are the
 * tree reader's, reported with their line and column; Jackson does not expand aliases, so nothing
 * grows before the first one is refused.
 */
final class YamlShape {
  private YamlShape() {}

  /** The first event a catalog does not allow, as the parse meets it; the caller adds the file's name. */
  static final class Refused extends JsonProcessingException {
    private static final long serialVersionUID = 1L;
    private final transient Mark mark;
    private final String problem;

    Refused(String problem, Mark mark) {
      super(problem);
      this.problem = problem;
      this.mark = mark;
    }

    CatalogProblem in(String name) {
      return new CatalogProblem(at(name, mark), problem);
    }
  }

  /** A YAML factory whose parsers refuse tags, anchors and aliases as they read them. */
  static final class Factory extends YAMLFactory {
    private static final long serialVersionUID = 1L;

    Factory(LoaderOptions options) {
      super(new YAMLFactoryBuilder(new YAMLFactory()).loaderOptions(options));
    }

    @Override
    protected YAMLParser _createParser(Reader r, IOContext ctxt) {
      return new Checked(ctxt, _parserFeatures, _yamlParserFeatures, _loaderOptions, _objectCodec, r);
    }

    @Override
    protected YAMLParser _createParser(char[] data, int offset, int len, IOContext ctxt, boolean recyclable) {
      return new Checked(ctxt, _parserFeatures, _yamlParserFeatures, _loaderOptions, _objectCodec,
          new CharArrayReader(data, offset, len));
    }
  }

  private static final class Checked extends YAMLParser {
    Checked(IOContext ctxt, int parserFeatures, int formatFeatures, LoaderOptions options, ObjectCodec codec,
        Reader reader) {
      super(ctxt, parserFeatures, formatFeatures, options, codec, reader);
    }

    @Override
    protected Event getEvent() throws IOException {
      Event e = super.getEvent();
      String problem = e == null ? null : problem(e);
      if (problem != null) {
        throw new Refused(problem, e.getStartMark());
      }
      return e;
    }
  }

  /** What is wrong with one event, or null. */
  static String problem(Event e) {
    if (e instanceof AliasEvent a) {
      return "uses the alias *"
          + a.getAnchor()
          + " — a catalog does not use YAML anchors and aliases; write the value out in"
          + " full where it is needed";
    }
    if (e instanceof NodeEvent n && n.getAnchor() != null) {
      return "sets the anchor &"
          + n.getAnchor()
          + " — a catalog does not use YAML anchors and aliases; remove it and write values"
          + " out in full";
    }
    String tag =
        e instanceof ScalarEvent s
            ? s.getTag()
            : e instanceof CollectionStartEvent c ? c.getTag() : null;
    if (tag != null) {
      return "has the YAML tag "
          + shortTag(tag)
          + " — a catalog does not use tags; write plain values (quote text that"
          + " would otherwise read as a number or a boolean)";
    }
    return null;
  }

  private static String shortTag(String tag) {
    String standard = "tag:yaml.org,2002:";
    return tag.startsWith(standard) ? "!!" + tag.substring(standard.length()) : tag;
  }

  private static String at(String name, Mark m) {
    return m == null ? name : name + " line " + (m.getLine() + 1) + " column " + (m.getColumn() + 1);
  }
}
