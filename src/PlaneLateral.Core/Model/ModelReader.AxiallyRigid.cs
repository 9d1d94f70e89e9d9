
namespace PlaneLateral.Model;

// "axiallyRigid": true on a member: exactly inextensible by equation sharing (Assembly/DofMap.cs), for a member along x
// or y whose two ends are free along its axis.
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        /// <summary>The "axiallyRigid" token of each member that has it, by member index.</summary>
        private readonly Dictionary<int, JsonNode> _axiallyRigidTokens = [];

        /// <summary>An axially rigid member must lie along x or y (its constraint shares one displacement of its ends).</summary>
        private bool AlongAnAxis(Node a, Node b, JsonNode at, string id)
        {
            double dx = Math.Abs(b.X - a.X), dy = Math.Abs(b.Y - a.Y), tol = 1e-9 * Math.Max(dx, dy);
            if (dx <= tol || dy <= tol) return true;
            sink.Add(at, $"member \"{id}\" is inclined, and \"axiallyRigid\" is offered for members along x or y only (its two ends then share the displacement along it)",
                "remove \"axiallyRigid\" from the inclined member (give it a large area instead), or make it horizontal or vertical");
            return false;
        }

        /// <summary>
        /// Neither end of an axially rigid member may be held by a support along the member's axis: the constraint would
        /// hold the other end too and hide the member's force in a reaction at the wrong node.
        /// </summary>
        private void CheckAxiallyRigid(List<Member> members, List<Support> supports, List<Node> nodes)
        {
            foreach (var (index, at) in _axiallyRigidTokens)
            {
                var m = members[index];
                bool alongX = Math.Abs(nodes[m.End].Y - nodes[m.Start].Y) <= 1e-9 * Math.Abs(nodes[m.End].X - nodes[m.Start].X);
                var dof = alongX ? Dof.X : Dof.Y;
                foreach (int n in new[] { m.Start, m.End })
                    if (supports.FirstOrDefault(s => s.Node == n) is { } s && (s.Restrains(dof) || s.Spring(dof) > 0))
                        sink.Add(at, $"member \"{m.Id}\" is axially rigid and node \"{nodes[n].Id}\" at its end is supported along its axis ({(alongX ? "x" : "y")}): the constraint would tie the other end to the support",
                            "remove \"axiallyRigid\" from this member (a member from a support is held by the support already), or free the support along the member");
            }
        }
    }
}
