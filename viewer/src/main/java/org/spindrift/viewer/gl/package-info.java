/**
 * OpenGL plumbing: context, shaders, framebuffers, vertex arrays, font atlas, overlay, PNG
 * writing.
 *
 * Dependencies: may import org.spindrift.shared.* only.
 */
package org.spindrift.viewer.gl;
