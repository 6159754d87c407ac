/**
 * The catalog as the planner wrote it: immutable records, loading from YAML, JSON and CSV option
 * tables, and validation that names the exact input path of every problem.
 */
package dev.mixwright.catalog;
