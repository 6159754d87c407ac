package dev.mixwright.catalog;

/** A shared capacity per period (machine hours, labour hours, a supplier-limited component). */
public record Resource(String id, String label, String unit, double capacity) {}
