#version 330 core
// u < 0: solid colour; u >= 0: glyph coverage from the font atlas (red channel)
in vec2 v_uv;
in vec4 v_colour;
uniform sampler2D u_font;
out vec4 o_colour;
void main() {
    if (v_uv.x < 0.0) {
        o_colour = v_colour;
    } else {
        float a = texture(u_font, v_uv).r;
        o_colour = vec4(v_colour.rgb, v_colour.a * a);
    }
}
