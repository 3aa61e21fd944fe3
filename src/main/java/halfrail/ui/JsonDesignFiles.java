package halfrail.ui;

import halfrail.design.Design;
import halfrail.io.DesignFileException;
import halfrail.io.DesignFiles;

import java.io.IOException;
import java.nio.file.Path;

/**
 * The app's file actions backed by Halfrail's design files: strict reading (a bad file's
 * message names the JSON path) and atomic saving with a backup of the previous file.
 */
final class JsonDesignFiles implements DesignFileActions {
    @Override
    public Design read(Path file) throws IOException {
        try {
            return DesignFiles.read(file);
        } catch (DesignFileException e) {
            throw new IOException(e.getMessage(), e);
        }
    }

    @Override
    public void write(Design design, Path file) throws IOException {
        try {
            DesignFiles.save(design, file);
        } catch (DesignFileException e) {
            throw new IOException(e.getMessage(), e);
        }
    }

    @Override
    public String extension() {
        return "json";
    }
}
