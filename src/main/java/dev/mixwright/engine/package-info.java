/**
 * Engines that compute the points of a job (a sweep's chains of points, a scenario set's own solves and hold-out evaluations), each point on
 * its own and as bytes in, bytes out: the thread pool of one machine by default, others (Spark) found
 * by ServiceLoader. The driver alone turns results into output.
 */
package dev.mixwright.engine;
