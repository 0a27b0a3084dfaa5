package org.spindrift.viewer.ui;

/**
 * A reusable text buffer with number formatting that does not allocate (fixed decimals, or
 * three significant digits), for labels rebuilt every frame.
 */
public final class Text implements CharSequence {
    private final StringBuilder sb = new StringBuilder(256);

    public Text clear() {
        sb.setLength(0);
        return this;
    }

    public Text add(CharSequence s) {
        sb.append(s);
        return this;
    }

    public Text add(char c) {
        sb.append(c);
        return this;
    }

    public Text add(long v) {
        sb.append(v);
        return this;
    }

    /** Appends v with the given number of decimals (rounded half away from zero). */
    public Text fixed(double v, int decimals) {
        if (Double.isNaN(v)) {
            sb.append("n/a");
            return this;
        }
        if (Double.isInfinite(v) || Math.abs(v) > 1e15) {
            return sci(v);
        }
        long scale = 1;
        for (int i = 0; i < decimals; i++) {
            scale *= 10;
        }
        long q = Math.round(Math.abs(v) * scale);
        if (v < 0 && q != 0) {
            sb.append('-');
        }
        sb.append(q / scale);
        if (decimals > 0) {
            sb.append('.');
            long f = q % scale;
            for (long d = scale / 10; d > 0; d /= 10) {
                sb.append((char) ('0' + (f / d) % 10));
            }
        }
        return this;
    }

    /** Appends v with about three significant digits, in fixed notation when that is short. */
    public Text sig3(double v) {
        double a = Math.abs(v);
        if (a == 0 || Double.isNaN(v)) {
            return fixed(v, 0);
        }
        if (a >= 1e5 || a < 1e-3) {
            return sci(v);
        }
        // three significant digits: sky angles of distant nuclei are small fractions of a micro-arcsecond
        int digits = Math.max(0, 2 - (int) Math.floor(Math.log10(a)));
        return fixed(v, digits);
    }

    /** Like {@link #sig3} but without trailing zeros after the decimal point (2 rather than 2.00). */
    public Text num(double v) {
        int start = sb.length();
        sig3(v);
        int dot = -1;
        int exp = -1;
        for (int i = start; i < sb.length(); i++) {
            char c = sb.charAt(i);
            if (c == '.') {
                dot = i;
            } else if (c == 'e') {
                exp = i;
            }
        }
        if (dot < 0 || exp >= 0) {
            return this;
        }
        int end = sb.length();
        while (end > dot + 1 && sb.charAt(end - 1) == '0') {
            end--;
        }
        if (end == dot + 1) {
            end = dot;
        }
        sb.setLength(end);
        return this;
    }

    private Text sci(double v) {
        if (Double.isInfinite(v)) {
            sb.append(v > 0 ? "inf" : "-inf");
            return this;
        }
        int e = (int) Math.floor(Math.log10(Math.abs(v)));
        double m = v / Math.pow(10, e);
        if (Math.abs(m) >= 9.995) {
            m /= 10;
            e++;
        }
        fixed(m, 2);
        sb.append('e').append(e);
        return this;
    }

    @Override public int length() {
        return sb.length();
    }

    @Override public char charAt(int index) {
        return sb.charAt(index);
    }

    @Override public CharSequence subSequence(int start, int end) {
        return sb.subSequence(start, end);
    }

    @Override public String toString() {
        return sb.toString();
    }
}
