#version 330 core
// 2D overlay: pixel coordinates (origin top-left) -> clip space
layout(location = 0) in vec2 a_pos;
layout(location = 1) in vec2 a_uv;
layout(location = 2) in vec4 a_colour;
uniform vec2 u_viewport;
out vec2 v_uv;
out vec4 v_colour;
void main() {
    vec2 ndc = vec2(a_pos.x / u_viewport.x * 2.0 - 1.0, 1.0 - a_pos.y / u_viewport.y * 2.0);
    gl_Position = vec4(ndc, 0.0, 1.0);
    v_uv = a_uv;
    v_colour = a_colour;
}
