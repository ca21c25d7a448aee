package nearfit.plot;

import java.util.EnumMap;
import java.util.Map;

/**
 * Colours for roles, as 0xRRGGBB, with a background. nearfit's own two palettes:
 * {@link #night()} for dark terminals (density grows brighter) and {@link #paper()} for
 * pictures on a light ground (density grows darker). Immutable.
 */
public final class Palette {
    private final int background;
    private final int[] rgb;

    private Palette(int background, Map<Role, Integer> colours) {
        this.background = background;
        this.rgb = new int[Role.values().length];
        for (Role r : Role.values()) {
            Integer c = colours.get(r);
            rgb[r.ordinal()] = c == null ? -1 : c;
        }
    }

    /** @return the palette for dark terminal backgrounds */
    public static Palette night() {
        return new Palette(0x101418, colours(
                new int[] {0x8A8F98, 0xA9B0BA, 0xC8CDD4, 0xF2E6C9},
                new int[] {0x3E5C63, 0x4F7F86, 0x5FA3A8, 0x7CC7C4, 0xB4EDE2},
                0xF0C75E,
                new int[] {0x6FB6E8, 0xE58A6F, 0x9BD07A, 0xC99BE6, 0xE8D36F, 0x71D6C1, 0xE78AB8, 0xB9A27A},
                new int[] {0xB07ACF, 0xFF9A3C, 0xFF4F6A, 0x9FA8B3, 0xFFE066, 0x6C8EBF}));
    }

    /** @return the palette for pictures on a light ground */
    public static Palette paper() {
        return new Palette(0xFBF8F1, colours(
                new int[] {0x4A4F57, 0x4A4F57, 0x2F333A, 0x1E2228},
                new int[] {0xB9D3D0, 0x8DB8B6, 0x5E9A9B, 0x367A7E, 0x1B5559},
                0xC7861A,
                new int[] {0x2F7FC1, 0xC8553D, 0x4E9A3A, 0x8A58B8, 0xB59A10, 0x1F9E89, 0xC24C8A, 0x7D6544},
                new int[] {0x8C4FB5, 0xD9561E, 0xC0143C, 0x6E7681, 0xB8860B, 0x4C6FA8}));
    }

    /** text: axis, tick label, label, title; marks: band, curve, flag, crosshair, marker, width. */
    private static Map<Role, Integer> colours(int[] text, int[] density, int highlight, int[] classes, int[] marks) {
        Map<Role, Integer> m = new EnumMap<>(Role.class);
        Role[] textRoles = {Role.AXIS, Role.TICK_LABEL, Role.LABEL, Role.TITLE};
        for (int i = 0; i < textRoles.length; i++) {
            m.put(textRoles[i], text[i]);
        }
        for (int l = 1; l <= Role.DENSITY_LEVELS; l++) {
            m.put(Role.points(l), density[l - 1]);
        }
        m.put(Role.HIGHLIGHT, highlight);
        for (int k = 0; k < Role.CLASS_COUNT; k++) {
            m.put(Role.ofClass(k), classes[k]);
        }
        Role[] markRoles = {Role.BAND, Role.CURVE, Role.FLAG, Role.CROSSHAIR, Role.MARKER, Role.WIDTH};
        for (int i = 0; i < markRoles.length; i++) {
            m.put(markRoles[i], marks[i]);
        }
        return m;
    }

    /** @return the background colour, 0xRRGGBB */
    public int background() {
        return background;
    }

    /** @return a role's colour as 0xRRGGBB, or -1 for {@link Role#BLANK} (no colour) */
    public int rgb(Role role) {
        return rgb[role.ordinal()];
    }

    /**
     * The nearest colour of the xterm 256-colour set: the 6 × 6 × 6 cube (levels 0, 95, 135,
     * 175, 215, 255, indices 16–231) or the 24-step grey ramp (8 + 10 i, indices 232–255),
     * whichever is closer in squared RGB distance (common practice for 256-colour terminals).
     *
     * @return an index 16–255
     */
    public static int xterm256(int rgb) {
        int r = (rgb >> 16) & 0xFF;
        int g = (rgb >> 8) & 0xFF;
        int b = rgb & 0xFF;
        int ri = cubeIndex(r);
        int gi = cubeIndex(g);
        int bi = cubeIndex(b);
        int cube = 16 + 36 * ri + 6 * gi + bi;
        int cubeDist = sq(r - cubeLevel(ri)) + sq(g - cubeLevel(gi)) + sq(b - cubeLevel(bi));
        int mean = (r + g + b) / 3;
        int gi2 = Math.max(0, Math.min(23, Math.round((mean - 8) / 10f)));
        int grey = 8 + 10 * gi2;
        int greyDist = sq(r - grey) + sq(g - grey) + sq(b - grey);
        return greyDist < cubeDist ? 232 + gi2 : cube;
    }

    private static int cubeIndex(int v) {
        return v < 48 ? 0 : v < 115 ? 1 : (v - 35) / 40;
    }

    private static int cubeLevel(int i) {
        return i == 0 ? 0 : 55 + 40 * i;
    }

    private static int sq(int v) {
        return v * v;
    }
}
