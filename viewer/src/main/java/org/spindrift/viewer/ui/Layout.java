package org.spindrift.viewer.ui;

/**
 * Screen areas in framebuffer pixels, origin top-left: title bar, 3D view, sky panel and time bar.
 * Recomputed when the framebuffer size changes; no allocation.
 */
public final class Layout {
    public static final int TOP = 30;
    public static final int BOTTOM = 74;
    public static final int GAP = 8;

    public int width;
    public int height;
    public int viewX;
    public int viewY;
    public int viewW;
    public int viewH;
    public int skyX;
    public int skyY;
    public int skyW;
    public int skyH;
    public boolean bare;

    /**
     * @param bare the 3D view fills the frame (no panels, no text)
     * @param sky  whether to reserve the sky panel
     */
    public void update(int w, int h, boolean bare, boolean sky) {
        width = w;
        height = h;
        this.bare = bare;
        if (bare) {
            viewX = 0;
            viewY = 0;
            viewW = w;
            viewH = h;
            skyW = 0;
            skyH = 0;
            return;
        }
        int inner = Math.max(1, h - TOP - BOTTOM);
        int side = sky ? Math.max(200, Math.min((int) (0.36 * w), inner)) : 0;
        skyW = side;
        skyH = inner;
        skyX = w - side;
        skyY = TOP;
        viewX = 0;
        viewY = TOP;
        viewW = Math.max(1, w - side - (sky ? GAP : 0));
        viewH = inner;
    }

    /** @return the GL (bottom-left origin) y of an area whose top is at y with height hh */
    public int glY(int y, int hh) {
        return height - y - hh;
    }
}
