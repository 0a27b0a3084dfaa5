/**
 * The 3D panel: orbit camera, particle, landmark and trail layers, colour maps.
 *
 * Dependencies: may import viewer.gl, viewer.data and org.spindrift.shared.*.
 */
package org.spindrift.viewer.scene;
