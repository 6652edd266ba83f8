package org.viscarta.serve;

/** A request the workbench refuses: an HTTP status and a one-line message for the person. */
final class ApiError extends RuntimeException {

    private static final long serialVersionUID = 1L;

    private final int status;

    ApiError(int status, String message) {
        super(message);
        this.status = status;
    }

    int status() {
        return status;
    }

    static ApiError badRequest(String message) {
        return new ApiError(400, message);
    }

    static ApiError notFound(String message) {
        return new ApiError(404, message);
    }

    static ApiError forbidden(String message) {
        return new ApiError(403, message);
    }
}
