package org.spindrift.viewer.gl;

import static org.lwjgl.opengl.GL33C.*;

import java.io.IOException;
import java.io.InputStream;
import java.nio.FloatBuffer;
import java.nio.charset.StandardCharsets;
import org.joml.Matrix4fc;
import org.lwjgl.system.MemoryUtil;

/** A linked vertex + fragment program loaded from classpath resources under {@code shaders/}. */
public final class Shader implements AutoCloseable {
    private final int program;

    public Shader(String name) {
        int vs = compile(GL_VERTEX_SHADER, load(name + ".vert"), name + ".vert");
        int fs = compile(GL_FRAGMENT_SHADER, load(name + ".frag"), name + ".frag");
        program = glCreateProgram();
        glAttachShader(program, vs);
        glAttachShader(program, fs);
        glLinkProgram(program);
        if (glGetProgrami(program, GL_LINK_STATUS) == GL_FALSE) {
            throw new IllegalStateException("shader " + name + " does not link: " + glGetProgramInfoLog(program));
        }
        glDeleteShader(vs);
        glDeleteShader(fs);
    }

    private static String load(String file) {
        try (InputStream in = Shader.class.getResourceAsStream("/org/spindrift/viewer/shaders/" + file)) {
            if (in == null) {
                throw new IllegalStateException("missing shader resource " + file);
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IllegalStateException("cannot read shader " + file, e);
        }
    }

    private static int compile(int type, String src, String what) {
        int s = glCreateShader(type);
        glShaderSource(s, src);
        glCompileShader(s);
        if (glGetShaderi(s, GL_COMPILE_STATUS) == GL_FALSE) {
            throw new IllegalStateException("shader " + what + " does not compile: " + glGetShaderInfoLog(s));
        }
        return s;
    }

    public void use() {
        glUseProgram(program);
    }

    /** @return the uniform location (look up once, keep the int) */
    public int uniform(String name) {
        return glGetUniformLocation(program, name);
    }

    /**
     * Scratch for matrix uniforms, allocated once (off-heap). Even a MemoryStack buffer costs a small
     * heap object per call; this one costs nothing per frame. Render thread only.
     */
    private static final FloatBuffer MATRIX = MemoryUtil.memAllocFloat(16);

    /** Sets a mat4 uniform without allocating. Render thread only. */
    public static void setMatrix(int location, Matrix4fc m) {
        m.get(0, MATRIX);
        glUniformMatrix4fv(location, false, MATRIX);
    }

    @Override public void close() {
        glDeleteProgram(program);
    }
}
