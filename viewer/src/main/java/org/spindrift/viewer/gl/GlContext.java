package org.spindrift.viewer.gl;

import static org.lwjgl.glfw.GLFW.*;
import static org.lwjgl.opengl.GL33C.*;
import static org.lwjgl.system.MemoryUtil.NULL;

import org.lwjgl.glfw.GLFWErrorCallback;
import org.lwjgl.opengl.GL;
import org.lwjgl.opengl.GLCapabilities;

/**
 * A GLFW window with an OpenGL 3.3 core, forward-compatible context. Visible for the
 * interactive viewer, invisible for frame export and benchmarks (which render into a
 * {@link Framebuffer}). Failure to get a display or a 3.3 context raises
 * {@link DisplayUnavailableException}, never a stack trace.
 */
public final class GlContext implements AutoCloseable {
    private final long window;
    private final GLFWErrorCallback errorCallback;
    private String lastError = "";

    private GlContext(long window, GLFWErrorCallback cb) {
        this.window = window;
        this.errorCallback = cb;
    }

    /**
     * Opens a window and makes its context current.
     *
     * @param width   window width in screen units
     * @param height  window height
     * @param title   window title
     * @param visible false for offscreen work
     * @param samples multisample count for the default framebuffer (0 = none)
     */
    public static GlContext open(int width, int height, String title, boolean visible, int samples) {
        String display = System.getenv("DISPLAY");
        String wayland = System.getenv("WAYLAND_DISPLAY");
        boolean linux = System.getProperty("os.name", "").toLowerCase(java.util.Locale.ROOT).contains("linux");
        if (linux && (display == null || display.isEmpty()) && (wayland == null || wayland.isEmpty())) {
            throw new DisplayUnavailableException("no display (DISPLAY is not set)");
        }
        final StringBuilder err = new StringBuilder();
        try {
            GLFWErrorCallback cb = GLFWErrorCallback.create((code, description) -> {
                err.setLength(0);
                err.append(GLFWErrorCallback.getDescription(description));
            });
            glfwSetErrorCallback(cb);
            if (linux && display != null && !display.isEmpty() && (wayland == null || wayland.isEmpty())
                    && glfwPlatformSupported(GLFW_PLATFORM_X11)) {
                glfwInitHint(GLFW_PLATFORM, GLFW_PLATFORM_X11); // skip probing for Wayland
            }
            if (!glfwInit()) {
                releaseErrorCallback();
                throw new DisplayUnavailableException("cannot open the display (" + why(err) + ")");
            }
            glfwDefaultWindowHints();
            glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 3);
            glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 3);
            glfwWindowHint(GLFW_OPENGL_PROFILE, GLFW_OPENGL_CORE_PROFILE);
            glfwWindowHint(GLFW_OPENGL_FORWARD_COMPAT, GLFW_TRUE);
            glfwWindowHint(GLFW_VISIBLE, visible ? GLFW_TRUE : GLFW_FALSE);
            glfwWindowHint(GLFW_RESIZABLE, GLFW_TRUE);
            glfwWindowHint(GLFW_SAMPLES, samples);
            long w = glfwCreateWindow(width, height, title, NULL, NULL);
            if (w == NULL) {
                glfwTerminate();
                releaseErrorCallback();
                throw new DisplayUnavailableException("no OpenGL 3.3 core context (" + why(err) + ")");
            }
            glfwMakeContextCurrent(w);
            GLCapabilities caps = GL.createCapabilities();
            if (!caps.OpenGL33) {
                glfwDestroyWindow(w);
                glfwTerminate();
                releaseErrorCallback();
                throw new DisplayUnavailableException("the OpenGL driver does not offer version 3.3");
            }
            GlContext ctx = new GlContext(w, cb);
            ctx.lastError = err.toString();
            return ctx;
        } catch (UnsatisfiedLinkError | IllegalStateException e) {
            throw new DisplayUnavailableException("cannot load the GLFW/OpenGL native libraries ("
                    + firstLine(String.valueOf(e.getMessage())) + ")");
        }
    }

    private static String why(StringBuilder err) {
        return err.length() > 0 ? firstLine(err.toString()) : "unknown reason";
    }

    private static void releaseErrorCallback() {
        GLFWErrorCallback prev = glfwSetErrorCallback(null);
        if (prev != null) {
            prev.free();
        }
    }

    private static String firstLine(String s) {
        int i = s.indexOf('\n');
        return i < 0 ? s : s.substring(0, i);
    }

    public long window() {
        return window;
    }

    /** @return the renderer string, for example "llvmpipe (LLVM 15.0.6, 256 bits)" */
    public String renderer() {
        return glGetString(GL_RENDERER) + ", OpenGL " + glGetString(GL_VERSION);
    }

    /** @return whether the renderer is a software rasteriser (Mesa llvmpipe/softpipe/swrast, SwiftShader...) */
    public boolean software() {
        String r = String.valueOf(glGetString(GL_RENDERER)).toLowerCase(java.util.Locale.ROOT);
        return r.contains("llvmpipe") || r.contains("softpipe") || r.contains("swrast") || r.contains("swiftshader")
                || r.contains("software");
    }

    public String lastError() {
        return lastError;
    }

    @Override public void close() {
        GL.setCapabilities(null);
        glfwDestroyWindow(window);
        glfwTerminate();
        releaseErrorCallback();
    }
}
