package nearfit.tui.session;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;

import org.junit.jupiter.api.Test;

import nearfit.tui.keys.ViewState;
import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;

class StartSettingsTest {
    private static final List<ColumnInfo> SITE = List.of(
            new ColumnInfo("time", ColumnKind.TIME, 0), new ColumnInfo("turbine", ColumnKind.CATEGORY, 0),
            new ColumnInfo("wind_ms", ColumnKind.NUMBER, 0), new ColumnInfo("air_temp_c", ColumnKind.NUMBER, 0),
            new ColumnInfo("power_kw", ColumnKind.NUMBER, 0), new ColumnInfo("rotor_rpm", ColumnKind.NUMBER, 0));

    @Test
    void aFileWithTheSiteColumnsOpensOnPowerAgainstWindSpeed() {
        ViewState s = new StartSettings(List.of(), null, 0).initialState(SITE, 1000);
        assertEquals("power_kw", s.response());
        assertEquals(List.of("wind_ms"), s.inputs());
    }

    @Test
    void columnsAskedOnTheCommandLineWinOverTheSiteView() {
        ViewState s = new StartSettings(List.of("air_temp_c"), "rotor_rpm", 0).initialState(SITE, 1000);
        assertEquals("rotor_rpm", s.response());
        assertEquals(List.of("air_temp_c"), s.inputs());
    }

    @Test
    void otherFilesKeepTheLastNumberAsResponseAndTheFirstAsInput() {
        List<ColumnInfo> pump = List.of(new ColumnInfo("flow_m3h", ColumnKind.NUMBER, 0),
                new ColumnInfo("speed_rpm", ColumnKind.NUMBER, 0), new ColumnInfo("head_m", ColumnKind.NUMBER, 0));
        ViewState s = new StartSettings(List.of(), null, 0).initialState(pump, 1000);
        assertEquals("head_m", s.response());
        assertEquals(List.of("flow_m3h"), s.inputs());
    }
}
