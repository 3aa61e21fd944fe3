package halfrail.cli;

/** Output formats of {@code check}. */
public enum ReportFormat {
    /** Plain text for a terminal. */
    TEXT,
    /** One JSON document for pipelines. */
    JSON,
    /** Markdown for review comments. */
    MARKDOWN
}
