#version 330 core
in vec4 v_colour;
out vec4 o_colour;
void main() {
    if (v_colour.a <= 0.0) discard;
    o_colour = v_colour;
}
