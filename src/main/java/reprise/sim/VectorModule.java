package reprise.sim;

import java.lang.reflect.InvocationTargetException;
import java.util.Locale;

/**
 * Whether the JDK's vector API (the incubator module {@code jdk.incubator.vector}) can run
 * {@link SimdLockstepKernel}, and if so makes it readable.
 *
 * <p>Implementation note. In JDK 17 the module is resolved only when asked for at launch
 * ({@code --add-modules jdk.incubator.vector}). So that {@code java -jar reprise.jar} needs no flag, the
 * jar's manifest exports {@code java.base/jdk.internal.module} to the application, and when the module is
 * not in the boot layer this class asks {@code jdk.internal.module.Modules.loadModule} (the JDK's own way
 * to load a system module into a running VM, used for agents) to load it into a child layer, mapped to
 * its built-in class loader, so the JIT's vector intrinsics apply as usual. Anything unexpected (a JDK
 * without the module or that method, a class path launch without the export, a machine whose preferred
 * vectors are narrower than 512 bits, where 64-bit lane shifts would not compile to single
 * instructions) leaves the vector kernel unused, and the auto-vectorised {@link LockstepKernel} runs
 * instead, with identical results. The system property {@code reprise.simd=off} turns the vector
 * kernel off.
 */
final class VectorModule {
    private static final String MODULE = "jdk.incubator.vector";
    private static final String STATUS = detect();

    private VectorModule() {
    }

    /** Whether {@link SimdLockstepKernel} can be used in this VM. */
    static boolean available() {
        return STATUS.equals("available");
    }

    /** One line: "available", or why the vector kernel is not used. */
    static String status() {
        return STATUS;
    }

    private static String detect() {
        if ("off".equals(System.getProperty("reprise.simd", "").toLowerCase(Locale.ROOT))) {
            return "turned off (reprise.simd=off)";
        }
        if (ModuleLayer.boot().findModule(MODULE).isEmpty()) {
            try {
                Class.forName("jdk.internal.module.Modules").getMethod("loadModule", String.class).invoke(null,
                    MODULE);
            } catch (InvocationTargetException e) {
                return "module " + MODULE + " could not be loaded: " + e.getCause();
            } catch (ReflectiveOperationException | RuntimeException | LinkageError e) {
                return "module " + MODULE + " not loadable (launch with --add-modules " + MODULE + "): " + e;
            }
        }
        try {
            int bits = SimdLockstepKernel.preferredVectorBits();
            return bits >= SimdLockstepKernel.VECTOR_BITS ? "available"
                : "preferred vectors have " + bits + " bits, fewer than " + SimdLockstepKernel.VECTOR_BITS;
        } catch (LinkageError e) {
            return "module " + MODULE + " not readable: " + e;
        }
    }
}
