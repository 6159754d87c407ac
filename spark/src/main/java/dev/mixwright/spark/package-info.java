/**
 * The Spark engine: the points of a job as Spark tasks, one task a point, retried by Spark when they
 * fail; results and progress come back to the driver, which alone writes output.
 */
package dev.mixwright.spark;
