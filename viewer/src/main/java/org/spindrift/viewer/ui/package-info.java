/**
 * Head-up display: title, colour bar, legend, time bar, help, layout and allocation-free text.
 *
 * Dependencies: may import viewer.data, viewer.gl, viewer.scene and org.spindrift.shared.*.
 */
package org.spindrift.viewer.ui;
