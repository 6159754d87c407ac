/**
 * What a run leaves for people to read: result.json as a record tree, the variant codes and the
 * matrix view every view shares, and its views (the HTML report, the comparison of two runs, the
 * sweep table).
 */
package dev.mixwright.report;
