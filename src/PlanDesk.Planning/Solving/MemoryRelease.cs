using System.Runtime.InteropServices;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// Gives back the memory of a disposed model before the next is built, so that a solve's peak is its largest model
/// rather than the sum of the models built so far: the model's managed side (hundreds of thousands of variable
/// proxies at 50 plants) is garbage the GC may keep for a while, and on Linux glibc keeps memory the native solver
/// freed in its arenas unless asked to return it (measured at XL: the peak grew with each LP solved in turn).
/// </summary>
internal static class MemoryRelease
{
    private static bool trimUnavailable;

    public static void AfterModel()
    {
        GC.Collect(GC.MaxGeneration, GCCollectionMode.Forced, blocking: true, compacting: true);
        GC.WaitForPendingFinalizers();
        if (OperatingSystem.IsLinux() && !trimUnavailable)
        {
            try
            {
                MallocTrim(0);
            }
            catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
            {
                // Not glibc (e.g. musl): nothing to trim this way.
                trimUnavailable = true;
            }
        }
    }

    [DllImport("libc", EntryPoint = "malloc_trim")]
    private static extern int MallocTrim(nuint pad);
}
