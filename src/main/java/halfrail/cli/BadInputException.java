package halfrail.cli;

/** Bad input that ends a command with {@link ExitCodes#BAD_INPUT}; the message is one line naming the file. */
final class BadInputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    BadInputException(String message) {
        super(message);
    }
}
