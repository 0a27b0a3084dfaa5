#version 330 core
// Unit sphere scaled into the oblate display shape of a constant-r surface:
// x, y scaled by sqrt(r^2 + a^2), z by r (display map of the run-archive layout)
layout(location = 0) in vec3 a_pos;
uniform mat4 u_viewProjection;
uniform vec3 u_scale;
uniform vec3 u_eye;
out vec3 v_normal;
out vec3 v_toEye;
void main() {
    vec3 p = a_pos * u_scale;
    gl_Position = u_viewProjection * vec4(p, 1.0);
    v_normal = normalize(a_pos / u_scale);
    v_toEye = u_eye - p;
}
