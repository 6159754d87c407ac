/**
 * The integer stage: a portfolio of whole variants with introduction costs, a variant limit and
 * minimum lots, chosen over the generated columns, with its gap to a bound valid for the whole space.
 * The method and its proof are written out in docs/portfolio.md.
 */
package dev.mixwright.portfolio;
