#version 330 core
// a textured rectangle in pixel coordinates (origin top-left)
layout(location = 0) in vec2 a_corner; // 0..1
uniform vec4 u_rect;       // x, y, w, h in pixels
uniform vec2 u_viewport;
uniform vec4 u_uv;         // u0, v0, u1, v1: texture coordinates at the rectangle's left/top and right/bottom
out vec2 v_uv;
void main() {
    vec2 p = u_rect.xy + a_corner * u_rect.zw;
    gl_Position = vec4(p.x / u_viewport.x * 2.0 - 1.0, 1.0 - p.y / u_viewport.y * 2.0, 0.0, 1.0);
    v_uv = mix(u_uv.xy, u_uv.zw, a_corner);
}
