package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Instant;
import org.junit.jupiter.api.Test;

class AxisTicksTest {

    private static double ms(String iso) {
        return Instant.parse(iso).toEpochMilli();
    }

    @Test
    void logTicksAreOneTwoFivePerDecade() {
        Ticks t = LogTicks.within(1, 200);
        assertArrayEquals(new String[] {"1", "2", "5", "10", "20", "50", "100", "200"}, t.labels());
    }

    @Test
    void logTicksOverManyDecadesArePowersOfTen() {
        Ticks t = LogTicks.within(0.01, 1e4);
        assertArrayEquals(new String[] {"0.01", "0.1", "1", "10", "100", "1000", "10000"}, t.labels());
    }

    @Test
    void aLogAxisPlacesEachDecadeEqually() {
        Axis a = new Axis(AxisKind.LOG, 1, 1000, LogTicks.within(1, 1000));
        assertEquals(1 / 3.0, a.fraction(10), 1e-12);
        assertEquals(2 / 3.0, a.fraction(100), 1e-12);
        assertEquals(100, a.valueAt(2 / 3.0), 1e-9);
    }

    @Test
    void timeTicksOverAWeekFallOnUtcMidnights() {
        Ticks t = TimeTicks.within(ms("2026-03-02T05:00:00Z"), ms("2026-03-08T20:00:00Z"), 8);
        assertArrayEquals(new String[] {"2026-03-03", "2026-03-04", "2026-03-05", "2026-03-06", "2026-03-07", "2026-03-08"}, t.labels());
        assertEquals(ms("2026-03-03T00:00:00Z"), t.values()[0]);
    }

    @Test
    void timeTicksWithinOneDayShowHoursOnly() {
        Ticks t = TimeTicks.within(ms("2026-03-14T00:10:00Z"), ms("2026-03-14T23:00:00Z"), 5);
        assertArrayEquals(new String[] {"06:00", "12:00", "18:00"}, t.labels());
    }

    @Test
    void timeTicksAcrossDaysAtHourStepsCarryTheDate() {
        Ticks t = TimeTicks.within(ms("2026-03-14T20:00:00Z"), ms("2026-03-15T04:00:00Z"), 3);
        assertEquals("2026-03-15T00:00", t.labels()[1]);
    }

    @Test
    void timeTicksOverAYearAreMonths() {
        Ticks t = TimeTicks.within(ms("2025-01-10T00:00:00Z"), ms("2025-12-20T00:00:00Z"), 6);
        assertArrayEquals(new String[] {"2025-03", "2025-05", "2025-07", "2025-09", "2025-11"}, t.labels());
    }

    @Test
    void timeTicksOverDecadesAreYears() {
        Ticks t = TimeTicks.within(ms("2001-06-01T00:00:00Z"), ms("2029-06-01T00:00:00Z"), 5);
        assertTrue(t.size() >= 2 && t.size() <= 5, "count " + t.size());
        for (String l : t.labels()) {
            assertEquals(4, l.length(), l);
        }
    }

    @Test
    void weeklyTicksFallOnMondays() {
        Ticks t = TimeTicks.within(ms("2026-01-01T00:00:00Z"), ms("2026-02-20T00:00:00Z"), 8);
        // 2026-01-05 is a Monday (ISO 8601 weeks start on Monday)
        assertEquals("2026-01-05", t.labels()[0]);
        assertEquals(7 * 86_400_000.0, t.values()[1] - t.values()[0]);
    }
}
