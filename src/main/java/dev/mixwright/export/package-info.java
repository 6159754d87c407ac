/**
 * A finished run in forms a planner keeps: exports of its plan (variant codes and the matrix view
 * come from {@code report}) as CSV tables, an xlsx workbook and MPS models of the run's LP and MIP.
 */
package dev.mixwright.export;
