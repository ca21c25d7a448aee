package nearfit.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Iterator;
import java.util.Map;

import com.fasterxml.jackson.databind.JsonNode;
import org.junit.jupiter.api.Test;

/**
 * The fleet check agrees with the single-machine check (the outside reference here is the tool's own
 * single-machine path, itself checked against scikit-learn in the core's tests) on the whole demo log:
 * rows, scored and flagged counts over all and per turbine, and the same worst rows, the fleet's row index
 * being the CSV line less two (the header is line 1).
 */
class FleetCheckParityTest {
    @Test
    void csvCheckEqualsTheSingleMachineCheck() throws Exception {
        String model = FleetTestData.model().toString();
        String log = FleetTestData.DEMO_LOG.toString();
        FleetTestData.Result single = FleetTestData.single("check", model, log, "--format", "json", "--quiet");
        FleetTestData.Result fleet = FleetTestData.fleet("check", model, log, "--format", "json");
        assertEquals(single.status(), fleet.status(), fleet.toString());
        JsonNode s = single.json();
        JsonNode f = fleet.json();
        for (String field : new String[] {"rows", "scored", "flagged", "passed"}) {
            assertEquals(s.get(field), f.get(field), field);
        }
        assertEquals(s.get("beyond_reference"), f.get("beyond_reference"));
        assertEquals(s.get("by_group").size(), f.get("by_group").size());
        for (Iterator<Map.Entry<String, JsonNode>> it = s.get("by_group").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> g = it.next();
            assertEquals(g.getValue(), f.get("by_group").get(g.getKey()), "group " + g.getKey());
        }
        JsonNode sw = s.get("worst");
        JsonNode fw = f.get("worst");
        assertEquals(10, sw.size());
        assertEquals(sw.size(), fw.size());
        for (int i = 0; i < sw.size(); i++) {
            assertEquals(sw.get(i).get("line").asLong(), fw.get(i).get("row").asLong() + 2, "worst row " + i);
            assertEquals(log, fw.get(i).get("file").asText());
            for (String field : new String[] {"time", "group", "inputs", "response", "fit", "z"}) {
                assertEquals(sw.get(i).get(field), fw.get(i).get(field), "worst row " + i + " " + field);
            }
        }
        assertTrue(s.get("flagged").asLong() > 0, "the demo log has flagged rows");
    }
}
