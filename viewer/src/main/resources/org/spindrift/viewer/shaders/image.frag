#version 330 core
// intensity -> square-root stretch -> colour map row
in vec2 v_uv;
uniform sampler2D u_image;
uniform sampler2D u_maps;
uniform float u_max;
uniform float u_row;
out vec4 o_colour;
void main() {
    float v = texture(u_image, v_uv).r / u_max;
    float s = sqrt(clamp(v, 0.0, 1.0));
    o_colour = vec4(texture(u_maps, vec2(s * 0.996 + 0.002, u_row)).rgb, 1.0);
}
