package org.axistack.optics;

/** Thrown when paraxial optics is asked of a field that reflects the beam; carries where it turns. */
public final class ReflectionException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    private final transient Reflection reflection;

    public ReflectionException(Reflection reflection) {
        super(reflection.describe());
        this.reflection = reflection;
    }

    public Reflection reflection() {
        return reflection;
    }
}
