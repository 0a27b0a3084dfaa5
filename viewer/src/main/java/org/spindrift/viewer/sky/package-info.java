/**
 * The sky panel: image cube and centroid track read from the run folder.
 *
 * Dependencies: may import viewer.gl, viewer.scene, viewer.ui and org.spindrift.shared.*.
 */
package org.spindrift.viewer.sky;
