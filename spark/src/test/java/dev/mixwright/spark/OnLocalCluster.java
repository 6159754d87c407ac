package dev.mixwright.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.engine.Engine;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.Watch;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.spark.SparkConf;
import org.apache.spark.SparkContext;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;

/**
 * Tests on a Spark cluster of two executor JVMs on this machine ({@code local-cluster[2,1,1024]}),
 * one cluster a test class, which {@link SparkEngine} finds as the active context.
 */
abstract class OnLocalCluster {
  static SparkContext spark;

  @BeforeAll
  static void startCluster() throws Exception {
    // local-cluster launches each executor through SPARK_HOME's launcher, which wants a jars folder;
    // the classes themselves come from this JVM's class path (the pom sets SPARK_HOME here).
    Files.createDirectories(Path.of(System.getenv("SPARK_HOME"), "jars"));
    SparkConf conf = new SparkConf().setAppName("mixwright test").setMaster("local-cluster[2,1,1024]")
        .set("spark.executor.memory", "512m")
        .set("spark.executor.extraClassPath", System.getProperty("java.class.path"))
        .set("spark.ui.enabled", "false");
    spark = SparkContext.getOrCreate(conf);
  }

  @AfterAll
  static void stopCluster() {
    if (spark != null) {
      spark.stop();
      spark = null;
    }
  }

  /**
   * Every point's result of the job on the engine, by point; counts how often each point was reported
   * done in {@code timesDone} and lists the points of failed attempts in {@code failed}.
   */
  static byte[][] results(Engine engine, Job job, int[] timesDone, List<Integer> failed) throws Engine.JobFailed {
    byte[][] out = new byte[job.size()][];
    int done = engine.run(job, new Watch() {
      @Override
      public void done(int point, byte[] result, long millis) {
        timesDone[point]++;
        out[point] = result;
      }

      @Override
      public void failed(int point, int attempt, String why) {
        failed.add(point);
      }
    }, () -> false);
    assertEquals(job.size(), done);
    return out;
  }
}
