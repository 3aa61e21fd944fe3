package halfrail.parts;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class PartsLibraryTest {

    @Test
    void theBuiltInLibraryIsLoadedOnceAndSharedAcrossThreads() throws Exception {
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            Callable<PartsLibrary> get = PartsLibrary::builtIn;
            List<Future<PartsLibrary>> results = pool.invokeAll(List.of(get, get, get, get));
            for (Future<PartsLibrary> f : results) {
                assertSame(PartsLibrary.builtIn(), f.get());
            }
        } finally {
            pool.shutdown();
        }
    }

    @Test
    void lookupsFindEntriesByIdAndReturnEmptyForUnknownOnes() {
        PartsLibrary parts = PartsLibrary.builtIn();
        assertEquals("Polyester film (PET)",
                parts.capacitorTechnology(CapacitorTechnology.POLYESTER_FILM).orElseThrow().displayName());
        assertTrue(parts.capacitorTechnology("paper").isEmpty());
        assertTrue(parts.opAmpArchetype(null).isEmpty());
        assertTrue(parts.cellChemistry(CellChemistry.LI_ION).isPresent());
        assertTrue(parts.supplyStandard(SupplyStandard.USB2_PORT).isPresent());
        assertTrue(parts.supplyStandard("usb-9").isEmpty());
    }

    @Test
    void anUnknownIdNamesItselfAndTheKnownOnes() {
        PartsLibrary parts = PartsLibrary.builtIn();
        PartsException e = assertThrows(PartsException.class, () -> parts.requireCellChemistry("lead-acid"));
        assertEquals(PartsException.Kind.UNKNOWN_ID, e.kind());
        assertTrue(e.getMessage().contains("\"lead-acid\""), e.getMessage());
        for (CellChemistry c : parts.cellChemistries()) {
            assertTrue(e.getMessage().contains(c.id()), e.getMessage());
        }
        assertEquals(PartsException.Kind.UNKNOWN_ID,
                assertThrows(PartsException.class, () -> parts.requireOpAmpArchetype("fast")).kind());
        assertEquals(PartsException.Kind.UNKNOWN_ID,
                assertThrows(PartsException.class, () -> parts.requireCapacitorTechnology("paper")).kind());
        assertEquals(PartsException.Kind.UNKNOWN_ID,
                assertThrows(PartsException.class, () -> parts.requireSupplyStandard("usb-9")).kind());
    }

    @Test
    void aLibraryWithTwoEntriesOfOneIdIsRejected() {
        SupplyStandard usb = PartsLibrary.builtIn().requireSupplyStandard(SupplyStandard.USB2_PORT);
        PartsException e = assertThrows(PartsException.class,
                () -> new PartsLibrary(List.of(), List.of(), List.of(), List.of(usb, usb)));
        assertEquals(PartsException.Kind.DUPLICATE_ID, e.kind());
    }

    @Test
    void listsAreImmutable() {
        List<CellChemistry> cells = PartsLibrary.builtIn().cellChemistries();
        assertThrows(UnsupportedOperationException.class, cells::clear);
        assertThrows(UnsupportedOperationException.class,
                () -> PartsLibrary.builtIn().requireCapacitorTechnology(CapacitorTechnology.TANTALUM).basis().clear());
    }

    @Test
    @DisplayName("USB 2.0 port: 4.75–5.25 V at the port, low-power devices to about 4.4 V (USB 2.0 specification §7.2, secondary sources)")
    void usbPortRange() {
        SupplyStandard usb = PartsLibrary.builtIn().requireSupplyStandard(SupplyStandard.USB2_PORT);
        assertEquals(5.0, usb.nominalVolts());
        assertEquals(4.75, usb.portMinVolts());
        assertEquals(5.25, usb.portMaxVolts());
        assertEquals(4.4, usb.deviceMinVolts());
        assertTrue(usb.withinPortRange(4.9));
        assertTrue(!usb.withinPortRange(4.6));
    }

    @Test
    void idsMustBeLowercaseWordsJoinedByHyphens() {
        Map<String, String> basis = Map.of("portRange", "p", "deviceMinVolts", "d");
        for (String bad : List.of("USB", "usb port", "usb--port", "-usb", "usb_port", "")) {
            PartsException e = assertThrows(PartsException.class,
                    () -> new SupplyStandard(bad, "X", 5, 4.75, 5.25, 4.4, "n", basis), bad);
            assertEquals("id", e.field());
        }
        new SupplyStandard("usb2-port", "X", 5, 4.75, 5.25, 4.4, "n", basis);
    }
}
