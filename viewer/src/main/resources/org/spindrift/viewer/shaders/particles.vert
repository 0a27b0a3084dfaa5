#version 330 core
// Particles of two neighbouring snapshots (A, B), mixed linearly in time on the GPU.
layout(location = 0) in vec3 a_posA;
layout(location = 1) in vec4 a_qA;     // redshift, weight, radius, alive
layout(location = 2) in vec3 a_posB;
layout(location = 3) in vec4 a_qB;
layout(location = 4) in float a_source;
uniform mat4 u_viewProjection;
uniform float u_mix;          // 0 = snapshot A, 1 = snapshot B
uniform int u_quantity;       // 0 redshift, 1 emission, 2 radius, 3 source
uniform vec2 u_range;         // colour range of the quantity
uniform float u_pixelsPerUnit;// viewport height / (2 tan(fov/2))
uniform float u_size;         // sprite diameter, M
uniform vec3 u_map[5];        // colour map control points of the quantity (Palette), evenly spaced
uniform vec4 u_sources[8];
out vec4 v_colour;
void main() {
    vec3 p = mix(a_posA, a_posB, u_mix);
    vec4 q = mix(a_qA, a_qB, u_mix);
    float alive = u_mix < 0.5 ? a_qA.w : a_qB.w;
    gl_Position = u_viewProjection * vec4(p, 1.0);
    float depth = max(gl_Position.w, 1e-3); // perspective projection: clip w = -z in eye space
    gl_PointSize = alive > 0.5 ? clamp(u_size * u_pixelsPerUnit / depth, 3.0, 48.0) : 0.0;
    if (alive < 0.5) {
        gl_Position = vec4(2.0, 2.0, 2.0, 1.0); // outside the clip volume
    }
    if (u_quantity == 3) {
        v_colour = u_sources[int(a_source) % 8];
    } else {
        float value = u_quantity == 0 ? q.x : (u_quantity == 1 ? q.y : q.z);
        float t = clamp((value - u_range.x) / max(u_range.y - u_range.x, 1e-30), 0.0, 1.0);
        // piecewise-linear map, as Palette.map (no texture fetch: cheaper in software vertex shading)
        float x = t * 4.0;
        int i = min(int(x), 3);
        v_colour = vec4(mix(u_map[i], u_map[i + 1], x - float(i)), 1.0);
    }
}
