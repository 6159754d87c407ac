package dev.mixwright.engine;

import java.io.Serializable;
import java.util.List;

/**
 * What an engine computes: the class of the work ({@link PointWork}), the bytes every point shares,
 * and each point's own bytes. Small by design (a catalog and a few bytes a point), so that it travels
 * to workers as it is.
 */
public record Job(String work, byte[] shared, List<byte[]> points) implements Serializable {
  private static final long serialVersionUID = 1L;

  public Job {
    points = List.copyOf(points);
  }

  public int size() {
    return points.size();
  }
}
