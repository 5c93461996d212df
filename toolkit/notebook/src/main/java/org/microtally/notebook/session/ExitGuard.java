package org.microtally.notebook.session;

import java.lang.invoke.MethodHandle;
import java.lang.invoke.MethodHandles;
import java.lang.invoke.MethodType;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;

/**
 * The targets that cell bytecode calls instead of the JVM exit methods and of the reflective and
 * method-handle doors to them (see {@code ExitCallRewriter}). The exit methods always throw
 * {@link ExitBlockedException}; the doors do what the original call does, except that they refuse
 * an exit method ({@code Method.invoke}) or hand back a handle that throws ({@code findStatic},
 * {@code findVirtual}, {@code unreflect}, {@code bind}). The doors are checked again when reached through
 * themselves (reflection on {@code Method.invoke}, a handle to {@code findStatic}, ...).
 *
 * <p>One difference a cell may notice: reflection on a non-public member without
 * {@code setAccessible(true)} is checked against this class rather than the cell's class, so it
 * is refused ({@code IllegalAccessException}); call {@code setAccessible(true)} first.
 * Public only because rewritten cell classes must be able to link against it; not for direct use.
 */
public final class ExitGuard {
    private static final MethodHandles.Lookup OWN = MethodHandles.lookup();

    private ExitGuard() { }

    /** Replaces {@code System.exit(status)}: always throws. */
    public static void exit(int status) {
        throw new ExitBlockedException("System.exit", status);
    }

    /** Replaces {@code runtime.exit(status)}: always throws. */
    public static void runtimeExit(Runtime runtime, int status) {
        throw new ExitBlockedException("Runtime.exit", status);
    }

    /** Replaces {@code runtime.halt(status)}: always throws. */
    public static void runtimeHalt(Runtime runtime, int status) {
        throw new ExitBlockedException("Runtime.halt", status);
    }

    /** Replaces {@code method.invoke(target, args)}. */
    public static Object invoke(Method method, Object target, Object... args)
            throws IllegalAccessException, InvocationTargetException {
        Method guard = counterpart(method.getDeclaringClass(), method.getName(), MethodType.methodType(method.getReturnType(),
                method.getParameterTypes()), java.lang.reflect.Modifier.isStatic(method.getModifiers()));
        if (guard == null) {
            return method.invoke(target, args);
        }
        Object[] all = args == null ? new Object[0] : args;
        Object[] withReceiver = all;
        if (!java.lang.reflect.Modifier.isStatic(method.getModifiers())) {
            withReceiver = new Object[all.length + 1];
            withReceiver[0] = target;
            System.arraycopy(all, 0, withReceiver, 1, all.length);
        }
        return guard.invoke(null, withReceiver);
    }

    /** Replaces {@code lookup.findStatic(refc, name, type)}. */
    public static MethodHandle findStatic(MethodHandles.Lookup lookup, Class<?> refc, String name, MethodType type)
            throws NoSuchMethodException, IllegalAccessException {
        Method guard = counterpart(refc, name, type, true);
        return guard == null ? lookup.findStatic(refc, name, type) : OWN.unreflect(guard);
    }

    /** Replaces {@code lookup.findVirtual(refc, name, type)}. */
    public static MethodHandle findVirtual(MethodHandles.Lookup lookup, Class<?> refc, String name, MethodType type)
            throws NoSuchMethodException, IllegalAccessException {
        Method guard = counterpart(refc, name, type, false);
        return guard == null ? lookup.findVirtual(refc, name, type) : OWN.unreflect(guard);
    }

    /** Replaces {@code lookup.unreflect(method)}. */
    public static MethodHandle unreflect(MethodHandles.Lookup lookup, Method method) throws IllegalAccessException {
        Method guard = counterpart(method.getDeclaringClass(), method.getName(), MethodType.methodType(method.getReturnType(),
                method.getParameterTypes()), java.lang.reflect.Modifier.isStatic(method.getModifiers()));
        return guard == null ? lookup.unreflect(method) : OWN.unreflect(guard);
    }

    /** Replaces {@code lookup.bind(receiver, name, type)}. */
    public static MethodHandle bind(MethodHandles.Lookup lookup, Object receiver, String name, MethodType type)
            throws NoSuchMethodException, IllegalAccessException {
        Method guard = counterpart(receiver.getClass(), name, type, false);
        return guard == null ? lookup.bind(receiver, name, type) : OWN.unreflect(guard).bindTo(receiver);
    }

    /** The guard method standing in for {@code refc.name(type)}, or null when that method is not guarded. */
    private static Method counterpart(Class<?> refc, String name, MethodType type, boolean isStatic) {
        String guard = null;
        if (refc == System.class && isStatic && name.equals("exit")) {
            guard = "exit";
        } else if (refc == Runtime.class && !isStatic && (name.equals("exit") || name.equals("halt"))) {
            guard = name.equals("exit") ? "runtimeExit" : "runtimeHalt";
        } else if (refc == Method.class && !isStatic && name.equals("invoke")) {
            guard = "invoke";
        } else if (refc == MethodHandles.Lookup.class && !isStatic
                && (name.equals("findStatic") || name.equals("findVirtual") || name.equals("unreflect") || name.equals("bind"))) {
            guard = name;
        }
        if (guard == null) {
            return null;
        }
        Class<?>[] params = isStatic ? type.parameterArray() : type.insertParameterTypes(0, refc).parameterArray();
        try {
            return ExitGuard.class.getMethod(guard, params);
        } catch (NoSuchMethodException e) {
            return null;   // another overload: not an exit route
        }
    }
}
