package nearfit.plot;

import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.Arrays;

/**
 * Ticks for a time axis given in epoch milliseconds, in UTC, at calendar-friendly steps (seconds,
 * minutes, hours, days, ISO weeks starting Monday, months, years), labelled in ISO 8601 forms:
 * {@code 2026-03}, {@code 2026-03-14}, {@code 2026-03-14T06:00}, or {@code 06:00} when the
 * whole range lies within one UTC day.
 */
public final class TimeTicks {
    private static final long SECOND = 1000L;
    private static final long MINUTE = 60 * SECOND;
    private static final long HOUR = 60 * MINUTE;
    private static final long DAY = 24 * HOUR;
    // Fixed steps, ms; then months (1, 2, 3, 6) and years (nice numbers).
    private static final long[] FIXED = {SECOND, 2 * SECOND, 5 * SECOND, 10 * SECOND, 15 * SECOND, 30 * SECOND,
        MINUTE, 2 * MINUTE, 5 * MINUTE, 10 * MINUTE, 15 * MINUTE, 30 * MINUTE,
        HOUR, 2 * HOUR, 3 * HOUR, 6 * HOUR, 12 * HOUR, DAY, 2 * DAY, 7 * DAY};
    private static final int[] MONTHS = {1, 2, 3, 6};
    // 1970-01-05, the first Monday after the epoch.
    private static final long MONDAY = 4 * DAY;

    private TimeTicks() {
    }

    /**
     * @param minMs lower end, epoch ms
     * @param maxMs upper end, epoch ms, at least minMs
     * @param count the most ticks wished, at least 2
     * @return ticks within [minMs, maxMs] at the finest step giving at most {@code count}
     */
    public static Ticks within(double minMs, double maxMs, int count) {
        if (!(minMs <= maxMs) || Double.isInfinite(minMs) || Double.isInfinite(maxMs)) {
            throw new IllegalArgumentException("time axis range " + minMs + ".." + maxMs);
        }
        long min = (long) Math.ceil(minMs);
        long max = (long) Math.floor(maxMs);
        int wished = Math.max(count, 2);
        for (long step : FIXED) {
            if ((max - min) / step + 1 <= wished) {
                long origin = step == 7 * DAY ? MONDAY : 0;
                long first = origin + Math.floorDiv(min - origin + step - 1, step) * step;
                return fixedTicks(first, max, step, min, max);
            }
        }
        for (int months : MONTHS) {
            if (monthsBetween(min, max) / months + 1 <= wished) {
                return calendarTicks(min, max, months);
            }
        }
        int years = (int) Math.max(1, NiceTicks.niceNumber(monthsBetween(min, max) / 12.0 / (wished - 1), false));
        return calendarTicks(min, max, 12 * years);
    }

    private static Ticks fixedTicks(long first, long last, long step, long min, long max) {
        int n = first > last ? 0 : (int) ((last - first) / step + 1);
        double[] vs = new double[n];
        String[] ls = new String[n];
        DateTimeFormatter f = formatter(step, min, max);
        for (int i = 0; i < n; i++) {
            long t = first + i * step;
            vs[i] = t;
            ls[i] = f.format(LocalDateTime.ofEpochSecond(Math.floorDiv(t, 1000), 0, ZoneOffset.UTC));
        }
        return new Ticks(vs, ls);
    }

    private static DateTimeFormatter formatter(long step, long min, long max) {
        boolean oneDay = Math.floorDiv(min, DAY) == Math.floorDiv(max, DAY);
        if (step >= DAY) {
            return DateTimeFormatter.ISO_LOCAL_DATE;
        }
        String time = step < MINUTE ? "HH:mm:ss" : "HH:mm";
        return DateTimeFormatter.ofPattern(oneDay ? time : "uuuu-MM-dd'T'" + time);
    }

    private static long monthsBetween(long min, long max) {
        LocalDate a = day(min);
        LocalDate b = day(max);
        return (b.getYear() - a.getYear()) * 12L + b.getMonthValue() - a.getMonthValue();
    }

    /** Ticks on the first of every {@code months}-th month (counted from year 0), within the range. */
    private static Ticks calendarTicks(long min, long max, int months) {
        LocalDate start = day(min).withDayOfMonth(1);
        long index = start.getYear() * 12L + start.getMonthValue() - 1;
        index = Math.floorDiv(index + months - 1, months) * months;
        double[] vs = new double[16];
        String[] ls = new String[16];
        int n = 0;
        DateTimeFormatter f = DateTimeFormatter.ofPattern(months % 12 == 0 ? "uuuu" : "uuuu-MM");
        for (; ; index += months) {
            LocalDate d = LocalDate.of((int) Math.floorDiv(index, 12), (int) Math.floorMod(index, 12) + 1, 1);
            long t = d.atStartOfDay(ZoneOffset.UTC).toInstant().toEpochMilli();
            if (t > max) {
                break;
            }
            if (t >= min) {
                if (n == vs.length) {
                    vs = Arrays.copyOf(vs, 2 * n);
                    ls = Arrays.copyOf(ls, 2 * n);
                }
                vs[n] = t;
                ls[n++] = f.format(d);
            }
        }
        return new Ticks(Arrays.copyOf(vs, n), Arrays.copyOf(ls, n));
    }

    private static LocalDate day(long ms) {
        return LocalDate.ofInstant(Instant.ofEpochMilli(ms), ZoneOffset.UTC);
    }
}
