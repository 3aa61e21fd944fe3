package halfrail.ui;

import java.nio.file.Path;

/** A second process for {@link InstanceLockTest}: claims a slot, says which, holds it until its input closes. */
public final class InstanceLockHolder {
    private InstanceLockHolder() {}

    public static void main(String[] args) throws Exception {
        try (InstanceLock lock = InstanceLock.acquire(Path.of(args[0])).orElseThrow()) {
            System.out.println("slot " + lock.slot());
            System.out.flush();
            while (System.in.read() >= 0) {
                // wait for the test to close our input
            }
        }
    }
}
