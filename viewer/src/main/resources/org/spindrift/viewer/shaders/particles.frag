#version 330 core
// Round sprite with a soft rim and a slightly brighter core.
in vec4 v_colour;
out vec4 o_colour;
void main() {
    vec2 c = gl_PointCoord * 2.0 - 1.0;
    float d2 = dot(c, c);
    if (d2 > 1.0) discard;
    float edge = 1.0 - smoothstep(0.55, 1.0, d2);
    vec3 rgb = v_colour.rgb * (0.85 + 0.25 * (1.0 - d2));
    o_colour = vec4(min(rgb, vec3(1.0)), 0.9 * edge);
}
