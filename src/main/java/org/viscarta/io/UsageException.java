package org.viscarta.io;

/**
 * A request that cannot be carried out as asked — an option value that is not understood, a
 * target that is not among the samples, a library without references of the class named — told
 * in one line. Like {@link InputException}, it exits with 2 and no stack trace; anything else
 * that escapes is an internal error.
 */
public final class UsageException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    public UsageException(String message) {
        super(message);
    }
}
