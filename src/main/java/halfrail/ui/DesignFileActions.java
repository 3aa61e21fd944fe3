package halfrail.ui;

import halfrail.design.Design;

import java.io.IOException;
import java.nio.file.Path;

/**
 * How the app reads and writes design files. The app does not know the file format: whoever
 * starts it passes an implementation (backed by the design-file layer), or none, in which case
 * the open and save commands stay disabled. Implementations are called off the FX thread.
 */
public interface DesignFileActions {
    /** Read a design. @throws IOException with a message fit to show the user (naming the field for a bad file) */
    Design read(Path file) throws IOException;

    /** Write a design (atomically, where the implementation can). */
    void write(Design design, Path file) throws IOException;

    /** The file name ending the files use, without the dot (for example {@code json}). */
    String extension();
}
