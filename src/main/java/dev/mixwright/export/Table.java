package dev.mixwright.export;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * One table of an export: a name (the CSV file's and the sheet's), a header and rows, with lines to
 * show above it (the matrix view's shared choices). A cell is a {@link String} (text), a {@link
 * Double} (a number; NaN is an empty cell), a {@link Boolean}, or null (empty).
 */
record Table(String name, List<String> above, List<String> header, List<List<Object>> rows) {

  Table {
    above = List.copyOf(above);
    header = List.copyOf(header);
    List<List<Object>> copy = new ArrayList<>();
    for (List<Object> r : rows) {
      for (Object c : r) {
        if (c != null && !(c instanceof String) && !(c instanceof Double) && !(c instanceof Boolean)) {
          throw new IllegalArgumentException("a cell is text, a number or a boolean, not " + c.getClass());
        }
      }
      copy.add(Collections.unmodifiableList(new ArrayList<>(r)));
    }
    rows = List.copyOf(copy);
  }
}
