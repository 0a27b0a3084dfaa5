#version 330 core
// 3D lines; trails fade with age and are hidden after the current time
layout(location = 0) in vec3 a_pos;
layout(location = 1) in vec4 a_colour;
layout(location = 2) in float a_time;
uniform mat4 u_viewProjection;
uniform int u_trail;
uniform float u_now;
uniform float u_span;
out vec4 v_colour;
void main() {
    gl_Position = u_viewProjection * vec4(a_pos, 1.0);
    float a = a_colour.a;
    if (u_trail == 1) {
        float age = u_now - a_time;
        a *= age < -1e-4 ? 0.0 : clamp(1.0 - age / u_span, 0.12, 1.0);
    }
    v_colour = vec4(a_colour.rgb, a);
}
