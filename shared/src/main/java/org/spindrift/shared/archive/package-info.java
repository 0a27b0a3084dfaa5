/**
 * The run archive: the one definition of file names, landmark keys and end-state codes
 * (ArchiveLayout) and of CSV columns (ArchiveColumns), atomic writes with sha256 of the bytes as
 * written, the folder lock and build-then-swap writer, the readers (RunArchive, LightArchive)
 * and the verifier.
 *
 * Dependencies: may import org.spindrift.shared and org.spindrift.shared.scenario; never the
 * engine.
 */
package org.spindrift.shared.archive;
