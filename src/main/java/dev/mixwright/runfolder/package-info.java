/**
 * The durable state of a run folder that resume needs: the manifest (run.json), state.json
 * snapshots, the checksummed column log, the lock, atomic files and checksums.
 */
package dev.mixwright.runfolder;
