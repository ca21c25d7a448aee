package nearfit.table;

/**
 * Reads ISO 8601 calendar dates and date-times straight from bytes, with no allocation:
 * {@code 2025-03-01}, {@code 2025-03-01T10:20}, {@code 2025-03-01 10:20:00}, {@code 2025-03-01T10:20:00.5Z},
 * {@code 2025-03-01T10:20:00+01:00} (also {@code +0100} and {@code +01}). No offset means UTC.
 * The space between date and time is the RFC 3339 section 5.6 allowance; fractions beyond milliseconds
 * are truncated.
 */
final class TimeParser {
    /** Returned for text that is not such a date or date-time. */
    static final long NOT_A_TIME = Long.MIN_VALUE;

    private TimeParser() {
    }

    /** Epoch milliseconds of {@code b[s..e)}, or {@link #NOT_A_TIME}. */
    static long parse(byte[] b, int s, int e) {
        if (e - s < 10 || b[s + 4] != '-' || b[s + 7] != '-') {
            return NOT_A_TIME;
        }
        int year = digits(b, s, 4);
        int month = digits(b, s + 5, 2);
        int day = digits(b, s + 8, 2);
        if (year < 0 || month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) {
            return NOT_A_TIME;
        }
        long millis = daysFromCivil(year, month, day) * 86_400_000L;
        int p = s + 10;
        if (p == e) {
            return millis;
        }
        if ((b[p] != 'T' && b[p] != ' ' && b[p] != 't') || e - p < 6 || b[p + 3] != ':') {
            return NOT_A_TIME;
        }
        int hour = digits(b, p + 1, 2);
        int minute = digits(b, p + 4, 2);
        if (hour < 0 || hour > 23 || minute < 0 || minute > 59) {
            return NOT_A_TIME;
        }
        millis += hour * 3_600_000L + minute * 60_000L;
        p += 6;
        if (p < e && b[p] == ':') {
            int second = e - p >= 3 ? digits(b, p + 1, 2) : -1;
            if (second < 0 || second > 59) {
                return NOT_A_TIME;
            }
            millis += second * 1000L;
            p += 3;
            if (p < e && (b[p] == '.' || b[p] == ',')) {
                p++;
                int scale = 100;
                int start = p;
                while (p < e && b[p] >= '0' && b[p] <= '9') {
                    millis += (b[p] - '0') * scale;
                    scale /= 10;
                    p++;
                }
                if (p == start) {
                    return NOT_A_TIME;
                }
            }
        }
        return withOffset(b, p, e, millis);
    }

    /** Applies the zone designator in {@code b[p..e)}: none, Z, +hh, +hhmm or +hh:mm. */
    private static long withOffset(byte[] b, int p, int e, long millis) {
        int n = e - p;
        if (n == 0) {
            return millis;
        }
        if (n == 1 && (b[p] == 'Z' || b[p] == 'z')) {
            return millis;
        }
        if (b[p] != '+' && b[p] != '-') {
            return NOT_A_TIME;
        }
        int sign = b[p] == '+' ? 1 : -1;
        int hh = n >= 3 ? digits(b, p + 1, 2) : -1;
        int mm;
        if (n == 3) {
            mm = 0;
        } else if (n == 5) {
            mm = digits(b, p + 3, 2);
        } else if (n == 6 && b[p + 3] == ':') {
            mm = digits(b, p + 4, 2);
        } else {
            return NOT_A_TIME;
        }
        if (hh < 0 || hh > 18 || mm < 0 || mm > 59) {
            return NOT_A_TIME;
        }
        return millis - sign * (hh * 3_600_000L + mm * 60_000L);
    }

    /** The value of {@code n} ASCII digits at {@code b[p..]}, or -1. */
    private static int digits(byte[] b, int p, int n) {
        int v = 0;
        for (int i = 0; i < n; i++) {
            int c = b[p + i] - '0';
            if (c < 0 || c > 9) {
                return -1;
            }
            v = v * 10 + c;
        }
        return v;
    }

    private static int daysInMonth(int y, int m) {
        if (m == 2) {
            boolean leap = (y % 4 == 0 && y % 100 != 0) || y % 400 == 0;
            return leap ? 29 : 28;
        }
        return (m == 4 || m == 6 || m == 9 || m == 11) ? 30 : 31;
    }

    /**
     * Days since 1970-01-01 of a proleptic Gregorian date: H. Hinnant, "chrono-Compatible Low-Level Date
     * Algorithms", days_from_civil (from memory; checked against java.time in the tests).
     */
    static long daysFromCivil(int y, int m, int d) {
        y -= m <= 2 ? 1 : 0;
        long era = (y >= 0 ? y : y - 399) / 400;
        long yoe = y - era * 400;
        long doy = (153L * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;
        long doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
        return era * 146_097 + doe - 719_468;
    }
}
