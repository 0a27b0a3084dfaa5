#version 330 core
// Dark body with a faint rim so the silhouette reads against the background
in vec3 v_normal;
in vec3 v_toEye;
uniform vec3 u_colour;
uniform vec3 u_rim;
out vec4 o_colour;
void main() {
    float facing = abs(dot(normalize(v_normal), normalize(v_toEye)));
    float rim = pow(1.0 - facing, 4.0);
    o_colour = vec4(u_colour + u_rim * rim, 1.0);
}
