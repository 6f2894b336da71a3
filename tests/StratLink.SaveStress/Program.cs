// Saves two versions of a project over one target file, alternately, until killed. The no-lost-work
// test kills this process at random moments and checks that the target is always one complete version.
// Usage: StratLink.SaveStress VERSION_A VERSION_B TARGET
using StratLink.ProjectIO;

if (args.Length != 3)
{
    Console.Error.WriteLine("usage: StratLink.SaveStress VERSION_A VERSION_B TARGET");
    return 2;
}
var versions = new[] { ProjectReader.Load(args[0]), ProjectReader.Load(args[1]) };
foreach (var v in versions)
{
    if (v.Project is null || v.Problems.HasErrors)
    {
        Console.Error.WriteLine($"{v.FilePath}: {string.Join("; ", v.Problems)}");
        return 2;
    }
}
ProjectWriter.Save(versions[0].Project!, args[2]);
Console.Out.WriteLine("saving");
Console.Out.Flush();
for (long i = 1; ; i++) ProjectWriter.Save(versions[i % 2].Project!, args[2]);
