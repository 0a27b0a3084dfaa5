/**
 * The validation suite and the validate command: the engine's results against published
 * formulas, as a report.
 *
 * Dependencies: may import sim and shared.
 */
package org.spindrift.validation;
