package org.spindrift.viewer.app;

import static org.lwjgl.glfw.GLFW.*;
import static org.lwjgl.opengl.GL33C.*;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;
import org.spindrift.viewer.gl.PixelWriter;
import org.spindrift.viewer.ui.Hud;
import org.spindrift.viewer.ui.Layout;

/**
 * The interactive window: keys and mouse drive the {@link Playback} and the camera; every frame
 * is drawn by the {@link FrameComposer}. Event callbacks are created once; the loop allocates
 * nothing per frame (window sizes go into int arrays held in fields).
 */
public final class ViewerWindow {
    private final ViewerSession session;
    private final FrameComposer composer;
    private final Playback playback;
    private final long window;
    private final PixelWriter pixels = new PixelWriter();
    private double lastX;
    private double lastY;
    private boolean orbiting;
    private boolean panning;
    private boolean scrubbing;
    private boolean screenshotRequested;
    private boolean help = true;
    private double helpUntil;
    private final int[] sizeW = new int[1];
    private final int[] sizeH = new int[1];
    private boolean dirty = true;
    private int lastFbW = -1;
    private int lastFbH = -1;
    private int fbW = 1;
    private int fbH = 1;
    private int winW = 1;
    private int winH = 1;

    private ViewerWindow(ViewerSession s) {
        session = s;
        composer = s.composer();
        playback = s.playback();
        window = s.gl().window();
    }

    public static int run(ViewerSession.Options o) {
        try (ViewerSession s = new ViewerSession(o, true)) {
            new ViewerWindow(s).loop();
        }
        return 0;
    }

    private void loop() {
        glfwSwapInterval(1);
        installCallbacks();
        composer.help(true);
        helpUntil = glfwGetTime() + 6; // the help shows for a few seconds at start
        double last = glfwGetTime();
        while (!glfwWindowShouldClose(window)) {
            // paused and nothing happening: sleep until an event (or the help's timeout) instead of
            // redrawing the same picture; a virtual X server has no vertical sync to pace us
            boolean busy = playback.playing() || (help && helpUntil > 0) || composer.hud().messageShown(glfwGetTime());
            if (!busy && !dirty) {
                glfwWaitEventsTimeout(0.25);
            } else {
                glfwPollEvents();
            }
            double now = glfwGetTime();
            boolean frameDue = dirty || busy;
            dirty = false;
            playback.tick(now - last);
            last = now;
            if (help && now > helpUntil && helpUntil > 0) {
                help = false;
                helpUntil = 0;
                composer.help(false);
            }
            glfwGetFramebufferSize(window, sizeW, sizeH);
            fbW = Math.max(1, sizeW[0]);
            fbH = Math.max(1, sizeH[0]);
            glfwGetWindowSize(window, sizeW, sizeH);
            winW = Math.max(1, sizeW[0]);
            winH = Math.max(1, sizeH[0]);
            if (!frameDue && !sizeChanged()) {
                continue;
            }
            glBindFramebuffer(GL_FRAMEBUFFER, 0);
            if (!composer.render(fbW, fbH, playback, false, now)) {
                dirty = true; // the reader has not caught up yet: draw again when it has
            }
            if (screenshotRequested) {
                screenshotRequested = false;
                screenshot(now);
            }
            glfwSwapBuffers(window);
            // at most about 120 frames per second when the driver does not pace buffer swaps
            double spent = glfwGetTime() - now;
            if (spent < 1.0 / 120) {
                try {
                    Thread.sleep((long) ((1.0 / 120 - spent) * 1000));
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    break;
                }
            }
        }
        pixels.close();
    }

    private boolean sizeChanged() {
        boolean changed = fbW != lastFbW || fbH != lastFbH;
        lastFbW = fbW;
        lastFbH = fbH;
        return changed;
    }

    private void screenshot(double now) {
        String stamp = LocalDateTime.now().format(DateTimeFormatter.ofPattern("yyyyMMdd-HHmmss"));
        Path file = Path.of("spindrift-view-" + stamp + ".png").toAbsolutePath();
        glReadBuffer(GL_BACK);
        pixels.read(fbW, fbH);
        try {
            pixels.writePng(file, fbW, fbH);
            composer.hud().message("saved " + file, now + 4);
            System.out.println("view: saved " + file);
        } catch (IOException e) {
            composer.hud().message("could not write " + file + ": " + e.getMessage(), now + 6);
        }
    }

    /** Interface pixels per window (cursor) unit, horizontally. */
    private double scaleX() {
        return fbW / (double) winW / composer.scale();
    }

    /** Interface pixels per window (cursor) unit, vertically. */
    private double scaleY() {
        return fbH / (double) winH / composer.scale();
    }

    private void scrubTo(double xWin) {
        Layout l = composer.layout();
        double x = xWin * scaleX();
        double f = (x - Hud.sliderX0()) / Hud.sliderWidth(l);
        f = Math.max(0, Math.min(1, f));
        playback.seek(playback.start() + f * (playback.end() - playback.start()));
    }

    private void installCallbacks() {
        glfwSetKeyCallback(window, (win, key, scancode, action, mods) -> {
            if (action != GLFW_PRESS && action != GLFW_REPEAT) {
                return;
            }
            dirty = true;
            switch (key) {
                case GLFW_KEY_ESCAPE, GLFW_KEY_Q -> glfwSetWindowShouldClose(win, true);
                case GLFW_KEY_SPACE -> playback.togglePlay();
                case GLFW_KEY_RIGHT -> playback.step(1);
                case GLFW_KEY_LEFT -> playback.step(-1);
                case GLFW_KEY_UP, GLFW_KEY_EQUAL, GLFW_KEY_KP_ADD -> playback.faster();
                case GLFW_KEY_DOWN, GLFW_KEY_MINUS, GLFW_KEY_KP_SUBTRACT -> playback.slower();
                case GLFW_KEY_HOME -> playback.seekSnapshot(0);
                case GLFW_KEY_END -> playback.seekSnapshot(Integer.MAX_VALUE);
                case GLFW_KEY_C -> composer.scene().quantity(composer.scene().quantity().next());
                case GLFW_KEY_R -> composer.scene().resetCamera();
                case GLFW_KEY_O -> composer.scene().observerCamera();
                case GLFW_KEY_F -> composer.scene().faceOnCamera();
                case GLFW_KEY_LEFT_BRACKET -> composer.scene().spriteScale(1 / 1.25f);
                case GLFW_KEY_RIGHT_BRACKET -> composer.scene().spriteScale(1.25f);
                case GLFW_KEY_G -> composer.scene().toggleGrid();
                case GLFW_KEY_L -> composer.scene().toggleRings();
                case GLFW_KEY_T -> composer.scene().toggleTrails();
                case GLFW_KEY_P, GLFW_KEY_F12 -> screenshotRequested = true;
                case GLFW_KEY_H, GLFW_KEY_F1 -> {
                    help = !help;
                    helpUntil = 0;
                    composer.help(help);
                }
                default -> { }
            }
        });
        glfwSetMouseButtonCallback(window, (win, button, action, mods) -> {
            dirty = true;
            boolean down = action == GLFW_PRESS;
            if (!down) {
                orbiting = false;
                panning = false;
                scrubbing = false;
                return;
            }
            Layout l = composer.layout();
            if (button == GLFW_MOUSE_BUTTON_LEFT && Hud.onSlider(l, lastX * scaleX(), lastY * scaleY())) {
                scrubbing = true;
                scrubTo(lastX);
                return;
            }
            if (button == GLFW_MOUSE_BUTTON_RIGHT || button == GLFW_MOUSE_BUTTON_MIDDLE
                    || (button == GLFW_MOUSE_BUTTON_LEFT && (mods & GLFW_MOD_SHIFT) != 0)) {
                panning = true;
            } else if (button == GLFW_MOUSE_BUTTON_LEFT) {
                orbiting = true;
            }
        });
        glfwSetCursorPosCallback(window, (win, x, y) -> {
            double dx = x - lastX;
            double dy = y - lastY;
            lastX = x;
            lastY = y;
            dirty |= scrubbing || orbiting || panning;
            if (scrubbing) {
                scrubTo(x);
            } else if (orbiting) {
                composer.scene().camera().orbit(-dx * 0.008, -dy * 0.008);
            } else if (panning) {
                double h = composer.layout().viewH / scaleY();
                composer.scene().camera().pan(dx / h, dy / h);
            }
        });
        glfwSetScrollCallback(window, (win, sx, sy) -> {
            dirty = true;
            composer.scene().camera().zoom(Math.pow(0.88, sy));
        });
        glfwSetWindowRefreshCallback(window, win -> dirty = true);
    }
}
