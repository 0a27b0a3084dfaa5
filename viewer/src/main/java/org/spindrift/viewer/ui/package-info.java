/**
 * Head-up display: title, colour bar, legend, time bar, help, layout and allocation-free text.
 *
 * Dependencies: may import viewer.gl and org.spindrift.shared.*.
 */
package org.spindrift.viewer.ui;
