/**
 * Engines that compute the points of a job (sweep points, later scenario evaluations), each point on
 * its own and as bytes in, bytes out: the thread pool of one machine by default, others (Spark) found
 * by ServiceLoader. The driver alone turns results into output.
 */
package dev.mixwright.engine;
