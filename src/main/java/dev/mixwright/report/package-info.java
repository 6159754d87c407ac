/**
 * What a run leaves for people to read: result.json, the column log and their readable views.
 */
package dev.mixwright.report;
