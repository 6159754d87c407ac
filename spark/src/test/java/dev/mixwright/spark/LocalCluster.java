package dev.mixwright.spark;

import java.nio.file.Files;
import java.nio.file.Path;
import org.apache.spark.SparkConf;
import org.apache.spark.SparkContext;

/** A Spark cluster of two executor JVMs on this machine ({@code local-cluster[2,1,1024]}) for a test class. */
final class LocalCluster {
  private LocalCluster() {}

  static SparkContext start() throws Exception {
    // local-cluster launches each executor through SPARK_HOME's launcher, which wants a jars folder;
    // the classes themselves come from this JVM's class path (the pom sets SPARK_HOME here).
    Files.createDirectories(Path.of(System.getenv("SPARK_HOME"), "jars"));
    SparkConf conf = new SparkConf().setAppName("mixwright test").setMaster("local-cluster[2,1,1024]")
        .set("spark.executor.memory", "512m")
        .set("spark.executor.extraClassPath", System.getProperty("java.class.path"))
        .set("spark.ui.enabled", "false");
    return SparkContext.getOrCreate(conf);
  }
}
