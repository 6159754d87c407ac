/**
 * What-ifs over a catalog: a scenario's changes by id, scenario and sweep files, and the grid of
 * points a sweep solves.
 */
package dev.mixwright.scenario;
