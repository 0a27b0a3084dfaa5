package org.spindrift.viewer.gl;

import static org.lwjgl.opengl.GL33C.*;

/**
 * An offscreen render target: a multisampled colour + depth framebuffer object that is resolved
 * into a single-sampled one for reading pixels (frame export, screenshots, benchmarks).
 */
public final class Framebuffer implements AutoCloseable {
    private final int width;
    private final int height;
    private final int msFbo;
    private final int msColour;
    private final int msDepth;
    private final int fbo;
    private final int colour;

    public Framebuffer(int width, int height, int samples) {
        this.width = width;
        this.height = height;
        int maxSamples = glGetInteger(GL_MAX_SAMPLES);
        int s = Math.max(0, Math.min(samples, maxSamples));
        msFbo = glGenFramebuffers();
        glBindFramebuffer(GL_FRAMEBUFFER, msFbo);
        msColour = glGenRenderbuffers();
        glBindRenderbuffer(GL_RENDERBUFFER, msColour);
        glRenderbufferStorageMultisample(GL_RENDERBUFFER, s, GL_RGBA8, width, height);
        glFramebufferRenderbuffer(GL_FRAMEBUFFER, GL_COLOR_ATTACHMENT0, GL_RENDERBUFFER, msColour);
        msDepth = glGenRenderbuffers();
        glBindRenderbuffer(GL_RENDERBUFFER, msDepth);
        glRenderbufferStorageMultisample(GL_RENDERBUFFER, s, GL_DEPTH_COMPONENT24, width, height);
        glFramebufferRenderbuffer(GL_FRAMEBUFFER, GL_DEPTH_ATTACHMENT, GL_RENDERBUFFER, msDepth);
        check("multisampled");
        fbo = glGenFramebuffers();
        glBindFramebuffer(GL_FRAMEBUFFER, fbo);
        colour = glGenRenderbuffers();
        glBindRenderbuffer(GL_RENDERBUFFER, colour);
        glRenderbufferStorage(GL_RENDERBUFFER, GL_RGBA8, width, height);
        glFramebufferRenderbuffer(GL_FRAMEBUFFER, GL_COLOR_ATTACHMENT0, GL_RENDERBUFFER, colour);
        check("resolve");
        glBindFramebuffer(GL_FRAMEBUFFER, 0);
    }

    private static void check(String what) {
        int st = glCheckFramebufferStatus(GL_FRAMEBUFFER);
        if (st != GL_FRAMEBUFFER_COMPLETE) {
            throw new DisplayUnavailableException("the OpenGL driver cannot make a " + what
                    + " offscreen framebuffer (status 0x" + Integer.toHexString(st) + ")");
        }
    }

    /** Binds the multisampled target for drawing. */
    public void bind() {
        glBindFramebuffer(GL_FRAMEBUFFER, msFbo);
        glViewport(0, 0, width, height);
    }

    /** Resolves the samples and leaves the single-sampled target bound for reading. */
    public void resolve() {
        glBindFramebuffer(GL_READ_FRAMEBUFFER, msFbo);
        glBindFramebuffer(GL_DRAW_FRAMEBUFFER, fbo);
        glBlitFramebuffer(0, 0, width, height, 0, 0, width, height, GL_COLOR_BUFFER_BIT, GL_NEAREST);
        glBindFramebuffer(GL_FRAMEBUFFER, fbo);
    }

    public int width() {
        return width;
    }

    public int height() {
        return height;
    }

    @Override public void close() {
        glBindFramebuffer(GL_FRAMEBUFFER, 0);
        glDeleteRenderbuffers(msColour);
        glDeleteRenderbuffers(msDepth);
        glDeleteRenderbuffers(colour);
        glDeleteFramebuffers(msFbo);
        glDeleteFramebuffers(fbo);
    }
}
