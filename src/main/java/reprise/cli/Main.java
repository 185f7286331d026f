package reprise.cli;

/** Placeholder entry point while the build is being laid down. */
public final class Main {
    private Main() {
    }

    public static void main(String[] args) {
        System.out.println("reprise");
    }
}
