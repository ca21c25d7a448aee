package nearfit.cli;

/**
 * Numbers as text for the commands' reports, the same characters {@code String.format(Locale.ROOT, ...)}
 * writes for {@code %.6g} and {@code %.Nf}, without {@link java.util.Formatter}: its first use in a process
 * loads the locale data and a regular expression engine, 40–150 ms of a fresh process (docs/bench-startup.md),
 * more than the rest of a small {@code describe}.
 *
 * <p>Like the formatter, both round half up on the decimal digits of {@link Double#toString(double)}, the
 * shortest digits that read back as the same double. NumberTextTest compares both with the formatter.
 */
final class NumberText {
    private NumberText() {
    }

    /** As {@code String.format(Locale.ROOT, "%.6g", d)}: six significant digits, scientific outside [1e-4, 1e6). */
    static String significant6(double d) {
        return significant(d, 6);
    }

    /** As {@code String.format(Locale.ROOT, "%.{digits}g", d)} for 1 to 17 digits. */
    static String significant(double d, int digits) {
        if (Double.isNaN(d) || Double.isInfinite(d)) {
            return special(d);
        }
        Digits x = Digits.of(d);
        if (d != 0) {
            x.round(digits);
        }
        int e10 = d == 0 ? 0 : x.point - 1; // the value is d.ddd × 10^e10
        StringBuilder sb = new StringBuilder(digits + 8);
        if (x.negative) {
            sb.append('-');
        }
        if (e10 < -4 || e10 >= digits) {
            sb.append(x.digit(0));
            if (digits > 1) {
                sb.append('.');
                for (int i = 1; i < digits; i++) {
                    sb.append(x.digit(i));
                }
            }
            int e = Math.abs(e10);
            sb.append('e').append(e10 < 0 ? '-' : '+');
            if (e < 10) {
                sb.append('0');
            }
            return sb.append(e).toString();
        }
        x.appendFixed(sb, digits - 1 - e10);
        return sb.toString();
    }

    /** As {@code String.format(Locale.ROOT, "%.{decimals}f", d)}. */
    static String fixed(double d, int decimals) {
        if (Double.isNaN(d) || Double.isInfinite(d)) {
            return special(d);
        }
        Digits x = Digits.of(d);
        if (d != 0) {
            x.round(x.point + decimals);
        }
        StringBuilder sb = new StringBuilder(24);
        if (x.negative) {
            sb.append('-');
        }
        x.appendFixed(sb, decimals);
        return sb.toString();
    }

    private static String special(double d) {
        return Double.isNaN(d) ? "NaN" : d > 0 ? "Infinity" : "-Infinity";
    }

    /** The decimal digits of a double's magnitude: value = 0.d₀d₁d₂… × 10^point, no leading zero (zero: none). */
    private static final class Digits {
        final boolean negative;
        char[] digits;
        int count;
        int point;

        private Digits(boolean negative, char[] digits, int count, int point) {
            this.negative = negative;
            this.digits = digits;
            this.count = count;
            this.point = point;
        }

        static Digits of(double d) {
            boolean negative = Double.compare(d, 0.0) < 0; // -0.0 too, as the formatter
            String s = Double.toString(Math.abs(d)); // "123.45", "1.0E-5", "0.001"
            int exp = s.indexOf('E');
            int end = exp < 0 ? s.length() : exp;
            char[] digits = new char[end];
            int count = 0;
            int point = 0;
            boolean afterDot = false;
            for (int i = 0; i < end; i++) {
                char c = s.charAt(i);
                if (c == '.') {
                    afterDot = true;
                } else if (count == 0 && c == '0') {
                    if (afterDot) {
                        point--; // a leading zero after the point: 0.001
                    }
                } else {
                    digits[count++] = c;
                    if (!afterDot) {
                        point++;
                    }
                }
            }
            while (count > 0 && digits[count - 1] == '0') {
                count--;
            }
            if (exp >= 0) {
                point += Integer.parseInt(s, exp + 1, s.length(), 10);
            }
            if (count == 0) {
                point = 0;
            }
            return new Digits(negative, digits, count, point);
        }

        /** Keeps {@code keep} digits, rounding half up on the next one; fewer than one keeps none or a carried 1. */
        void round(int keep) {
            if (keep >= count) {
                return;
            }
            if (keep < 0) {
                count = 0;
                return;
            }
            boolean up = digits[keep] >= '5';
            count = keep;
            if (!up) {
                while (count > 0 && digits[count - 1] == '0') {
                    count--;
                }
                return;
            }
            int i = keep - 1;
            while (i >= 0 && digits[i] == '9') {
                i--;
            }
            if (i < 0) { // 999.5 -> 1000: one digit, one place up
                digits[0] = '1';
                count = 1;
                point++;
            } else {
                digits[i]++;
                count = i + 1;
            }
        }

        char digit(int i) {
            return i < count ? digits[i] : '0';
        }

        /** The magnitude with {@code decimals} digits after the point (already rounded to them). */
        void appendFixed(StringBuilder sb, int decimals) {
            if (count == 0 || point <= 0) {
                sb.append('0');
            } else {
                for (int i = 0; i < point; i++) {
                    sb.append(digit(i));
                }
            }
            if (decimals > 0) {
                sb.append('.');
                for (int i = 0; i < decimals; i++) {
                    int at = point + i;
                    sb.append(count == 0 || at < 0 ? '0' : digit(at));
                }
            }
        }
    }
}
