package nearfit.table;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryMXBean;

/**
 * Run in a child JVM by {@link HeapBoundTest}: loads a file and prints the heap the table holds (used heap
 * after a full collection, minus the same before loading), then {@code rows=N}.
 */
public final class HeapProbe {
    private HeapProbe() {
    }

    public static void main(String[] args) {
        MemoryMXBean mem = ManagementFactory.getMemoryMXBean();
        System.gc();
        long before = mem.getHeapMemoryUsage().getUsed();
        Table t = CsvLoader.load(args[0], LoadOptions.DEFAULT);
        System.gc();
        long after = mem.getHeapMemoryUsage().getUsed();
        System.out.println("held=" + (after - before) + " rows=" + t.rowCount() + " columns=" + t.columnCount());
    }
}
