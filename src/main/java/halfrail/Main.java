package halfrail;

/** Entry point placeholder; replaced by the command line front. */
public final class Main {
    private Main() {}
    public static void main(String[] args) {}
}
